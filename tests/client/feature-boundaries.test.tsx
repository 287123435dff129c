import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Imports run one way: components/ui and lib → features → app. A feature never imports
 * another feature, and shared code never imports a feature or the app. (Checked here because
 * the lint config is shared; this keeps the rule next to the client tests.)
 */
const SRC = join(import.meta.dirname, '../../src');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? files(path) : /\.tsx?$/.test(name) ? [path] : [];
  });
}

function imports(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return [...text.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2]);
}

function resolved(file: string, spec: string): string | null {
  return spec.startsWith('.') ? relative(SRC, join(file, '..', spec)) : null;
}

describe('client import directions', () => {
  it('features do not import each other', () => {
    const offenders: string[] = [];
    for (const file of files(join(SRC, 'features'))) {
      const own = relative(SRC, file).split('/')[1];
      for (const spec of imports(file)) {
        const target = resolved(file, spec);
        const match = target && /^features\/([^/]+)/.exec(target);
        if (match && match[1] !== own) offenders.push(`${relative(SRC, file)} → ${spec}`);
      }
    }
    expect(offenders).toEqual([]);
  });

  it('lib and components import neither features nor the app', () => {
    const offenders: string[] = [];
    for (const file of [...files(join(SRC, 'lib')), ...files(join(SRC, 'components'))]) {
      for (const spec of imports(file)) {
        const target = resolved(file, spec);
        if (target && /^(features|app)\//.test(target)) offenders.push(`${relative(SRC, file)} → ${spec}`);
      }
    }
    expect(offenders).toEqual([]);
  });

  it('the check sees imports at all', () => {
    expect(imports(join(SRC, 'app/router.tsx')).length).toBeGreaterThan(3);
  });
});
