// Runs in the browser before the app's own code. Zod 4 probes `new Function('')` once to decide
// whether it may compile fast parsers; under our Content-Security-Policy (no 'unsafe-eval', see
// next.config.mjs) that probe is blocked and reported as a CSP violation even though zod recovers.
// `jitless` skips the probe. Zod reads its settings from this global, so zod need not be imported
// here (and is not pulled into pages that do not use it); the object is changed in place in case
// zod has already taken its reference.
const zodConfig = globalThis as typeof globalThis & { __zod_globalConfig?: Record<string, unknown> };
(zodConfig.__zod_globalConfig ??= {}).jitless = true;
