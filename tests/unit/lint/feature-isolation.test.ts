/**
 * Features don't import each other (DEVELOPERS.md, "How the code is laid out"): the ESLint rule
 * import-x/no-restricted-paths holds it. These lint made-up files placed inside the features, with
 * the project's own ESLint configuration, so a change to the zones that lets a cross-feature
 * import through fails here.
 */
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const RULE = 'import-x/no-restricted-paths';

let eslint: ESLint;
beforeAll(() => {
  eslint = new ESLint({ cwd: root });
});

/** The messages of that one rule for `code` as if it were the file at `filePath`. */
async function restrictedPaths(filePath: string, code: string) {
  const [result] = await eslint.lintText(code, { filePath });
  return result!.messages.filter((m) => m.ruleId === RULE).map((m) => m.message);
}

// Generous: the first lint loads the TypeScript parser and resolver on a shared machine.
const SLOW = 120_000;

describe('feature isolation', () => {
  it(
    'refuses one feature importing another, by alias or by relative path',
    async () => {
      const messages = await restrictedPaths(
        'src/features/feeds/components/isolation-fixture.tsx',
        [
          "import { PinGrid } from '@/features/pin-map/components/pin-grid.tsx';",
          "import { pinRows } from '../../pin-map/lib/rows.ts';",
          'export const used = [PinGrid, pinRows];',
          '',
        ].join('\n'),
      );
      expect(messages).toHaveLength(2);
      expect(messages[0]).toMatch(/Features don't import each other/);
    },
    SLOW,
  );

  it(
    'refuses a feature importing the app, and the shared pieces importing a feature',
    async () => {
      expect(
        await restrictedPaths(
          'src/features/checks/components/isolation-fixture.tsx',
          "import { router } from '@/app/router.tsx';\nexport const used = router;\n",
        ),
      ).toEqual([expect.stringMatching(/composed by src\/app/)]);
      expect(
        await restrictedPaths(
          'src/lib/isolation-fixture.ts',
          "import { useFeeds } from '@/features/feeds/api/get-feeds.ts';\nexport const used = useFeeds;\n",
        ),
      ).toEqual([expect.stringMatching(/shared by every feature/)]);
    },
    SLOW,
  );

  it(
    'lets a feature use its own folder, the shared pieces and shared/, and a route compose features',
    async () => {
      expect(
        await restrictedPaths(
          'src/features/feeds/components/isolation-fixture.tsx',
          [
            "import { FeedForm } from './feed-form.tsx';",
            "import { useFeeds } from '../api/get-feeds.ts';",
            "import { Button } from '@/components/ui/button.tsx';",
            "import { paths } from '@/config/paths.ts';",
            "import { ApiError } from '@/lib/api-client.ts';",
            "import { FEED_SOURCES } from '#shared/schemas/feeds.schema.ts';",
            'export const used = [FeedForm, useFeeds, Button, paths, ApiError, FEED_SOURCES];',
            '',
          ].join('\n'),
        ),
      ).toEqual([]);
      expect(
        await restrictedPaths(
          'src/app/routes/isolation-fixture.tsx',
          [
            "import { FeedForm } from '@/features/feeds/components/feed-form.tsx';",
            "import { PinGrid } from '@/features/pin-map/components/pin-grid.tsx';",
            'export const used = [FeedForm, PinGrid];',
            '',
          ].join('\n'),
        ),
      ).toEqual([]);
    },
    SLOW,
  );
});
