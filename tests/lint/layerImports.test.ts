import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

// The project's own ESLint configuration, run on snippets placed at chosen paths.
const eslint = new ESLint({ cwd: process.cwd() });

async function layerProblems(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return (result?.messages ?? []).filter((m) => m.ruleId === 'layers/layer-imports').map((m) => m.message);
}

describe('layer rule in eslint.config.js', () => {
  it('refuses a feature importing another feature, however deep the import', async () => {
    expect(
      await layerProblems('src/features/desk/Snippet.tsx', "export { PadScreen } from '../pad/PadScreen';\n"),
    ).toEqual([expect.stringContaining("'desk' feature imports the 'pad' feature")]);
    expect(
      await layerProblems(
        'src/features/cards/api/snippet.ts',
        "export const x = () => import('../../auth/routes');\n",
      ),
    ).toHaveLength(1);
  });

  it('refuses api, local, ui and account importing any feature', async () => {
    for (const layer of ['api', 'local', 'ui', 'account']) {
      expect(
        await layerProblems(
          `src/${layer}/snippet.ts`,
          "import { padRoutes } from '../features/pad/routes';\nexport { padRoutes };\n",
        ),
      ).toEqual([expect.stringContaining(`src/${layer} imports the 'pad' feature`)]);
    }
  });

  it('lets a feature use its own files and the shared layers, and the app assemble the features', async () => {
    expect(
      await layerProblems(
        'src/features/pad/api/snippet.ts',
        "import { localDb } from '../../../local/db';\nimport { usePadData } from '../usePadData';\nexport { localDb, usePadData };\n",
      ),
    ).toEqual([]);
    expect(
      await layerProblems('src/app/snippet.ts', "export { padRoutes } from '../features/pad/routes';\n"),
    ).toEqual([]);
  });
});
