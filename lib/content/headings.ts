import type { Element, ElementContent, Root, RootContent } from 'hast';

export type TocEntry = { id: string; text: string; depth: 2 | 3 };

/** An anchor id from a heading's text: lowercase words joined by hyphens. */
export function slugify(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/&/g, ' and ')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '') || 'section'
  );
}

function textOf(node: ElementContent | RootContent): string {
  if (node.type === 'text') return node.value;
  if ('children' in node) return (node.children as ElementContent[]).map(textOf).join('');
  return '';
}

/**
 * A rehype plugin that gives every h2/h3 a unique id (kept if the author set one) and records
 * them, in order, in `toc`: the table of contents is built from the same pass that sets the ids,
 * so the links and the anchors cannot disagree.
 */
export function rehypeHeadingIds(toc: TocEntry[]) {
  return () => (tree: Root) => {
    const used = new Map<string, number>();
    const visit = (node: Root | Element) => {
      for (const child of node.children) {
        if (child.type !== 'element') continue;
        if (child.tagName === 'h2' || child.tagName === 'h3') {
          const text = textOf(child).replace(/\s+/g, ' ').trim();
          const given = typeof child.properties.id === 'string' ? child.properties.id : null;
          const base = given ?? slugify(text);
          const n = used.get(base) ?? 0;
          used.set(base, n + 1);
          const id = n === 0 ? base : `${base}-${n + 1}`;
          child.properties.id = id;
          toc.push({ id, text, depth: child.tagName === 'h2' ? 2 : 3 });
        } else {
          visit(child);
        }
      }
    };
    visit(tree);
  };
}
