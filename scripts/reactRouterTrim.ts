/**
 * React Router ships one module for every mode (data routers, framework mode, forms), and its
 * components are made with `React.forwardRef(…)` calls the bundler must assume have side effects,
 * with a `displayName` written on each: so NavLink, Form, useSubmit and their helpers stayed in
 * the entry although the app never uses them (declarative routes, Link). This marks those calls
 * pure (forwardRef only wraps its function) and drops the `displayName` lines (read by React's
 * developer tools only), so the bundler leaves out what nothing uses: ~1.8 KiB gzip of every page.
 */
import { resolve } from 'node:path';
import type { Alias, Plugin } from 'vite';

const DIST = resolve(import.meta.dirname, '..', 'node_modules', 'react-router', 'dist');

/**
 * The package's production build (its development build, which the package's exports name for
 * browsers, differs only in turning the developer warnings on).
 */
export const reactRouterProduction: Alias[] = [
  { find: /^react-router$/, replacement: resolve(DIST, 'production', 'index.mjs') },
  { find: /^react-router\/dom$/, replacement: resolve(DIST, 'production', 'dom-export.mjs') },
];

export function trimReactRouter(code: string): string {
  return code
    .replace(/(?<![\w.])(React\d*\.forwardRef\()/g, '/* @__PURE__ */ $1')
    .replace(/^[\w$]+\.displayName = "[^"\n]*";$/gm, '');
}

export function reactRouterTrim(): Plugin {
  return {
    name: 'ringcall-react-router-trim',
    apply: 'build',
    transform: {
      filter: { id: /[\\/]react-router[\\/]dist[\\/]production[\\/]/ },
      handler: (code) => ({ code: trimReactRouter(code), map: null }),
    },
  };
}
