// Page titles name the product once, with one separator: the root layout's template adds
// " · Brinewright", so no page's own title may carry the name or a separator of its own.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(__dirname, '../..');

function pages(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return pages(full);
    return /^(page|layout)\.tsx$/.test(e.name) ? [full] : [];
  });
}

describe('page titles', () => {
  it('the layout template adds the product name once', () => {
    expect(fs.readFileSync(path.join(root, 'app/layout.tsx'), 'utf8')).toContain("template: '%s · Brinewright'");
  });

  it('no page title carries the product name or a separator of its own', () => {
    const titles = pages(path.join(root, 'app')).flatMap((file) =>
      [...fs.readFileSync(file, 'utf8').matchAll(/\btitle: ['`]([^'`]+)['`]/g)].map((m) => ({ file: path.relative(root, file), title: m[1] })),
    );
    expect(titles.length).toBeGreaterThan(15);
    const wrong = titles.filter((t) => t.file !== 'app/layout.tsx' && /Brinewright| — | · | \| /.test(t.title));
    expect(wrong).toEqual([]);
  });
});
