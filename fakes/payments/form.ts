/** Decodes the SDK's form encoding (`line_items[0][price_data][currency]=usd`) into nested objects and arrays. */
export function decodeForm(body: string): Record<string, unknown> {
  const root: Record<string, unknown> = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const parts = rawKey.replace(/\]/g, '').split('[');
    let node: Record<string, unknown> | unknown[] = root;
    parts.forEach((part, i) => {
      const last = i === parts.length - 1;
      const key: string | number = Array.isArray(node) ? Number(part) : part;
      const container = node as Record<string | number, unknown>;
      if (last) {
        container[key] = value;
        return;
      }
      if (container[key] === undefined) container[key] = /^\d+$/.test(parts[i + 1]) ? [] : {};
      node = container[key] as Record<string, unknown> | unknown[];
    });
  }
  return root;
}
