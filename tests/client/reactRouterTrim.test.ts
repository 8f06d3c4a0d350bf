import { readFileSync, readdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { reactRouterProduction, trimReactRouter } from '../../scripts/reactRouterTrim';

const production = resolve('node_modules/react-router/dist/production');
/** The shipped module with the components (the file names carry a hash). */
const componentsModule = readdirSync(production)
  .filter((f) => f.endsWith('.mjs'))
  .map((f) => readFileSync(resolve(production, f), 'utf8'))
  .find((code) => code.includes('var NavLink = '))!;

describe("React Router's trim", () => {
  it('finds the shipped components module (an upgrade that moves it fails here, not silently)', () => {
    expect(componentsModule).toBeDefined();
    expect(componentsModule).toContain('var ENABLE_DEV_WARNINGS = false;');
  });

  it('marks every forwardRef call pure and drops every displayName line', () => {
    const before = componentsModule.match(/React\d*\.forwardRef\(/g) ?? [];
    expect(before.length).toBeGreaterThan(2);
    const trimmed = trimReactRouter(componentsModule);
    expect(trimmed.match(/\/\* @__PURE__ \*\/ React\d*\.forwardRef\(/g)).toHaveLength(before.length);
    expect(trimmed).not.toMatch(/^[\w$]+\.displayName = /m);
    expect(trimmed).toContain('var NavLink = /* @__PURE__ */ React');
  });

  it('leaves other code alone', () => {
    const code = 'let a = React.forwardRef(f);\nfoo.displayName = "x";\nbar.displayName = name;\n';
    expect(trimReactRouter(code)).toBe('let a = /* @__PURE__ */ React.forwardRef(f);\n\nbar.displayName = name;\n');
  });

  it('points both of the package entries the app reaches at the production build', () => {
    const targets = reactRouterProduction.map((a) => String(a.replacement));
    expect(targets.every((t) => t.includes('/dist/production/'))).toBe(true);
    expect(readFileSync(targets[0]!, 'utf8')).toContain('react-router v');
  });
});
