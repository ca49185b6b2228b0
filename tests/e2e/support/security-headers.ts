// What every response of the production build must carry (set statically in next.config.mjs).
// Returns the problems found, so callers can collect them over many responses and report all at once.
export function securityHeaderProblems(response: Response): string[] {
  const problems: string[] = [];
  const get = (name: string) => response.headers.get(name);
  const csp = get('content-security-policy');
  if (!csp) problems.push('no Content-Security-Policy');
  else {
    const directives = new Map(
      csp
        .split(';')
        .map((d) => d.trim())
        .filter(Boolean)
        .map((d) => {
          const [name, ...values] = d.split(/\s+/);
          return [name.toLowerCase(), values] as const;
        }),
    );
    const script = directives.get('script-src') ?? directives.get('default-src') ?? [];
    if (script.includes("'unsafe-eval'")) problems.push("script-src allows 'unsafe-eval'");
    if (!script.length || script.includes('*') || script.some((v) => /^https?:$/.test(v))) problems.push(`script-src too wide: ${script.join(' ')}`);
    if (directives.get('frame-ancestors')?.join(' ') !== "'none'") problems.push("frame-ancestors is not 'none'");
    if (directives.get('object-src')?.join(' ') !== "'none'") problems.push("object-src is not 'none'");
    if (!directives.get('default-src')?.includes("'self'")) problems.push("default-src is not 'self'");
    if (!directives.has('base-uri')) problems.push('no base-uri');
  }
  if (get('x-content-type-options') !== 'nosniff') problems.push(`X-Content-Type-Options is ${get('x-content-type-options')}`);
  if (!['no-referrer', 'same-origin', 'strict-origin', 'strict-origin-when-cross-origin'].includes(get('referrer-policy') ?? ''))
    problems.push(`Referrer-Policy is ${get('referrer-policy')}`);
  if (get('x-frame-options') !== 'DENY') problems.push(`X-Frame-Options is ${get('x-frame-options')}`);
  if (!/camera=\(\)/.test(get('permissions-policy') ?? '')) problems.push(`Permissions-Policy is ${get('permissions-policy')}`);
  if (get('x-powered-by')) problems.push('X-Powered-By is sent');
  return problems;
}
