/**
 * The words of a lesson's prose: MDX/JSX tags, code, link targets, markdown markup and table
 * rules are left out, so components and formatting do not count towards a lesson's length.
 */
export function proseWords(body: string): string[] {
  const text = body
    .replace(/```[\s\S]*?```/g, ' ')
    .replace(/<!--[\s\S]*?-->/g, ' ')
    .replace(/\{\/\*[\s\S]*?\*\/\}/g, ' ')
    .replace(/<\/?[A-Za-z][^<>]*\/?>/g, ' ')
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/`[^`]*`/g, ' ')
    .replace(/^\s*\|?\s*:?-{3,}.*$/gm, ' ')
    .replace(/[#*_>|~]/g, ' ');
  return text.split(/\s+/).filter((word) => /[A-Za-z0-9]/.test(word));
}

export function countWords(body: string): number {
  return proseWords(body).length;
}
