import { defineConfig, type Plugin } from 'vitest/config';
import react from '@vitejs/plugin-react';

/**
 * The page's Content-Security-Policy. The plugin below writes it into the built index.html as a
 * `<meta http-equiv>` tag and sends it as a header from `vite preview` (a header also covers the
 * workers' scripts, which a document's meta tag does not). `npm run dev` goes without it, because
 * Vite's development server injects inline scripts.
 *
 * Everything is same-origin and nothing else is allowed, with one exception: `'unsafe-eval'` in
 * script-src. Typed formulas and update rules are compiled to JavaScript with `new Function` (on the
 * page for the main-thread surface, in the workers for runs, grids and studies). The source is
 * generated from the parsed tree only and passes a token allowlist first (engine/expr/codegen.ts,
 * engine/rules/codegen.ts), so no character the user typed reaches it. e2e/hardening.spec.ts checks
 * that the page runs under this policy with no violation, that no request leaves localhost, and that
 * formulas stop compiling without the exception.
 */
const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self' 'unsafe-eval'",
  "worker-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "manifest-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
].join('; ');

/** Writes the Content-Security-Policy into the built index.html (not in dev: see above). */
function contentSecurityPolicy(): Plugin {
  return {
    name: 'fall-line-csp',
    apply: 'build',
    transformIndexHtml: () => [{ tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }, injectTo: 'head-prepend' }],
  };
}

export default defineConfig({
  plugins: [react(), contentSecurityPolicy()],
  worker: { format: 'es' },
  build: { target: 'es2022', chunkSizeWarningLimit: 2000 },
  preview: { headers: { 'Content-Security-Policy': CONTENT_SECURITY_POLICY } },
  test: {
    include: ['test/**/*.test.ts'],
    environment: 'node',
    // Generous: the reference runs (NIST fits, property tests) take under a second on a quiet machine,
    // but CI machines can be several times slower; speed is measured by the benchmark, not here.
    testTimeout: 30_000,
  },
});
