// The import rules of `npm run lint` (.dependency-cruiser.cjs) are enforced, not just written down:
// a small tree made here breaks one rule at a time and dependency-cruiser must say so.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const cli = path.join(root, 'node_modules/dependency-cruiser/bin/dependency-cruise.mjs');
const config = path.join(root, '.dependency-cruiser.cjs');
let dir = '';

function tree(files: Record<string, string>) {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-lint-'));
  for (const [file, text] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(dir, file)), { recursive: true });
    fs.writeFileSync(path.join(dir, file), text);
  }
  const tops = [...new Set(Object.keys(files).map((f) => f.split('/')[0] as string))];
  const r = spawnSync(process.execPath, [cli, '--config', config, '--output-type', 'err', ...tops], { cwd: dir, encoding: 'utf8' });
  return { code: r.status, out: `${r.stdout}${r.stderr}` };
}
afterEach(() => fs.rmSync(dir, { recursive: true, force: true }));

describe('when one client feature imports another', () => {
  it('then the lint fails naming the rule, and the same code through src/components passes', () => {
    const bad = tree({
      'src/features/cart/components/total.tsx': "import { Badge } from '../../orders/components/badge.tsx';\nexport const Total = () => <Badge />;\n",
      'src/features/orders/components/badge.tsx': 'export const Badge = () => <span />;\n',
    });
    expect(bad.code).not.toBe(0);
    expect(bad.out).toContain('client-feature-isolation');
    expect(bad.out).toContain('src/features/cart/components/total.tsx → src/features/orders/components/badge.tsx');

    const good = tree({
      'src/features/cart/components/total.tsx': "import { Badge } from '../../../components/ui/badge.tsx';\nexport const Total = () => <Badge />;\n",
      'src/components/ui/badge.tsx': 'export const Badge = () => <span />;\n',
    });
    expect(good.out).not.toContain('client-feature-isolation');
    expect(good.code).toBe(0);
  });
});

describe('when a server feature reaches into another feature past its public module', () => {
  it('then the lint fails; through index.ts it passes', () => {
    const bad = tree({
      'server/features/refunds/refunds.service.ts': "import { ordersRepo } from '../orders/orders.repo.ts';\nexport const r = ordersRepo;\n",
      'server/features/orders/orders.repo.ts': 'export const ordersRepo = {};\n',
      'server/features/orders/index.ts': "export { ordersRepo } from './orders.repo.ts';\n",
    });
    expect(bad.code).not.toBe(0);
    expect(bad.out).toContain('server-feature-public-module-between-features');

    const good = tree({
      'server/features/refunds/refunds.service.ts': "import { ordersRepo } from '../orders/index.ts';\nexport const r = ordersRepo;\n",
      'server/features/orders/orders.repo.ts': 'export const ordersRepo = {};\n',
      'server/features/orders/index.ts': "export { ordersRepo } from './orders.repo.ts';\n",
    });
    expect(good.code).toBe(0);
  });
});

describe('when shared/ imports the server, or two modules import each other', () => {
  it('then the lint fails on each', () => {
    const shared = tree({ 'shared/money.ts': "import { x } from '../server/env.ts';\nexport const y = x;\n", 'server/env.ts': 'export const x = 1;\n' });
    expect(shared.out).toContain('shared-stands-alone');
    const cycle = tree({ 'shared/a.ts': "import { b } from './b.ts';\nexport const a = () => b;\n", 'shared/b.ts': "import { a } from './a.ts';\nexport const b = () => a;\n" });
    expect(cycle.out).toContain('no-circular');
    expect(cycle.code).not.toBe(0);
  });
});
