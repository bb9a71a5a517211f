import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { engineGlobalViolations, findViolations, importsOf, isEngineSource, sourceFiles } from '../support/import-rules';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));

describe('import direction', () => {
  it('holds across shared/, server/ and console/', () => {
    const files = sourceFiles(ROOT, ['shared', 'server', 'console']);
    expect(files.length).toBeGreaterThan(50);
    expect(findViolations(files)).toEqual([]);
  });

  it('keeps DOM and Node globals out of the engine (shared/dsp, shared/units)', () => {
    const engineFiles = sourceFiles(ROOT, ['shared/dsp', 'shared/units']).map((file) => file.path).filter(isEngineSource);
    expect(engineFiles.length).toBeGreaterThan(0);
    expect(engineGlobalViolations(ROOT, engineFiles)).toEqual([]);
  });
});

describe('the rule checker itself', () => {
  const check = (path: string, source: string) => findViolations([{ path, source }]);

  it('reads static, re-exported, dynamic and side-effect imports, and ignores comments', () => {
    const edges = importsOf(
      'console/features/keys/api/list.ts',
      `import { a } from '@shared/x';\nexport { b } from "../../../../server/y";\nconst c = await import('@console/app/z');\nimport '../side';\n// import { no } from '@server/commented';`,
    );
    expect(edges.map((edge) => edge.target)).toEqual(['shared/x', 'server/y', 'console/app/z', 'console/features/keys/side']);
  });

  it('catches each forbidden direction', () => {
    expect(check('shared/schemas/a.ts', "import { x } from '@server/db/client';")).toHaveLength(1);
    expect(check('shared/dsp/fft.ts', "import { x } from '../../console/lib/y';")).toHaveLength(1);
    expect(check('console/lib/api.ts', "import { x } from '@server/app';")).toHaveLength(1);
    expect(check('server/app.ts', "import { x } from '../console/main';")).toHaveLength(1);
    expect(check('shared/dsp/wav/read.ts', "import { readFileSync } from 'node:fs';")).toHaveLength(1);
    expect(check('shared/units/db.ts', "import path from 'path';")).toHaveLength(1);
    expect(check('console/features/api-keys/x.tsx', "import { y } from '@console/features/members/api/list';")).toHaveLength(1);
    expect(check('console/features/api-keys/x.tsx', "import { y } from '../members/z';")).toHaveLength(1);
    expect(check('console/features/api-keys/x.tsx', "import { router } from '@console/app/router';")).toHaveLength(1);
  });

  it('allows the intended directions', () => {
    expect(check('server/modules/a.ts', "import { x } from '@shared/schemas/auth';\nimport fs from 'node:fs';")).toEqual([]);
    expect(check('console/app/router.tsx', "import { x } from '@console/features/api-keys/components/list';")).toEqual([]);
    expect(check('console/features/api-keys/components/x.tsx', "import { y } from '../api/list';\nimport { z } from '@shared/problems';")).toEqual([]);
    expect(check('shared/dsp/fft.ts', "import FFT from 'fft.js';")).toEqual([]);
    expect(check('shared/dsp/wav/read.test.ts', "import { readFileSync } from 'node:fs';")).toEqual([]);
  });

  it('finds global DOM and Node use by type, not by name', () => {
    const scratch = mkdtempSync(path.join(tmpdir(), 'engine-rules-'));
    try {
      mkdirSync(path.join(scratch, 'shared/dsp'), { recursive: true });
      writeFileSync(path.join(scratch, 'shared/dsp/ok.ts'), 'export const hann = (window: number[]) => window.map((w) => w * 0.5);\n');
      writeFileSync(path.join(scratch, 'shared/dsp/dom.ts'), 'export const width = () => window.innerWidth;\n');
      writeFileSync(path.join(scratch, 'shared/dsp/node.ts'), 'export const seed = () => process.env.SEED;\n');
      const found = engineGlobalViolations(scratch, ['shared/dsp/ok.ts', 'shared/dsp/dom.ts', 'shared/dsp/node.ts']);
      expect(found).toHaveLength(2);
      expect(found.join('\n')).toMatch(/dom\.ts:1: uses the global "window"/);
      expect(found.join('\n')).toMatch(/node\.ts:1: uses the global "process"/);
    } finally {
      rmSync(scratch, { recursive: true, force: true });
    }
  });
});
