// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import mdx from '@astrojs/mdx';
import remarkMath from 'remark-math';
import rehypeKatex from 'rehype-katex';
import tailwindcss from '@tailwindcss/vite';
import prepareBundle from './integrations/prepare-bundle.mjs';
import serviceWorker from './integrations/service-worker.mjs';

// Astro 5.18 trusts the Host header only for listed domains; without them Astro.url is wrong and the
// built-in origin check refuses same-site form posts. Extra hosts come from ALLOWED_HOSTS at build time.
/** A guide's tables scroll sideways inside the reading column when wide, so keyboard users must reach them. */
function rehypeFocusableTables() {
  /** @typedef {{ type: string; tagName?: string; properties?: Record<string, unknown>; children?: HastNode[] }} HastNode */
  /** @param {HastNode} node */
  const visit = (node) => {
    if (node.type === 'element' && node.tagName === 'table') node.properties = { ...node.properties, tabIndex: 0 };
    for (const child of node.children ?? []) visit(child);
  };
  return visit;
}

const extraHosts = (process.env.ALLOWED_HOSTS ?? '')
  .split(',')
  .map((h) => h.trim())
  .filter(Boolean);

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'middleware', experimentalDisableStreaming: true }),
  // Formulas in guides ($…$ inline, $$…$$ on their own lines) become KaTeX HTML at build time: no client JS.
  integrations: [
    react(),
    mdx({ remarkPlugins: [remarkMath], rehypePlugins: [rehypeKatex, rehypeFocusableTables] }),
    prepareBundle(),
    serviceWorker(),
  ],
  security: {
    checkOrigin: true,
    allowedDomains: ['localhost', '127.0.0.1', ...extraHosts].map((hostname) => ({ hostname })),
  },
  server: { port: 4321, host: '127.0.0.1' },
  devToolbar: { enabled: false },
  // No inline scripts at all: islands are mounted by one bundled module (src/scripts/islands.ts, see
  // src/components/Island.astro) and every <script> is bundled to a file, so the policy is script-src 'self' with
  // nothing hashed per render (docs/decisions/020-islands-from-one-script.md). Astro's experimental.csp is off.
  vite: {
    plugins: [tailwindcss()],
    // Fonts (KaTeX's small ones included) stay files from our origin: a data: URL would break font-src 'self'.
    // Scripts are never inlined into the page either, however small: script-src 'self' allows only files.
    build: { assetsInlineLimit: (file) => (/\.(woff2?|ttf|otf|[cm]?[jt]sx?)$/.test(file) ? false : undefined) },
  },
});
