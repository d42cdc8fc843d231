// The import boundaries the lint config enforces, proved on deliberately bad imports (and on good ones, so a rule that
// fires on everything fails too). Each case lints a made-up file text under a real path: the plugin resolves the
// import on disk, so the target must exist; the file linted need not.
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
let eslint: ESLint;

beforeAll(async () => {
  eslint = new ESLint({ cwd: root, overrideConfigFile: 'tests/lint/eslint.config.js' });
  // The first lint loads the config, the parser and the resolver: done here, so no single case carries it.
  await eslint.lintText('export {};\n', { filePath: 'server/src/domain/errors.ts' });
}, 60_000);

async function boundaryMessages(filePath: string, importLine: string): Promise<string[]> {
  const [result] = await eslint.lintText(`${importLine}\nexport const used = imported;\n`, { filePath });
  return result.messages.filter((m) => m.ruleId === 'boundaries/dependencies').map((m) => m.message);
}

const HTTP_EDGE = /Only \*\.routes\.ts, server\/src\/http and app\.ts\/main\.ts may import server\/src\/http/;

describe('HTTP stays at the edge of the server', () => {
  it.each([
    ['a service raising an HTTP error', 'server/src/modules/plans/plans.service.ts', "import { notFound as imported } from '../../http/errors';"],
    ['a helper file of a module', 'server/src/modules/denials/shortfall.ts', "import { badRequest as imported } from '../../http/errors';"],
    ['a payments service (its own element type)', 'server/src/modules/payouts/payout.service.ts', "import { parse as imported } from '../../http/validate';"],
    ['finance', 'server/src/modules/finance/scope.ts', "import { canSeeStation as imported } from '../../http/require-role';"],
    ['the socket server', 'server/src/realtime/socket-server.ts', "import { canSeeStation as imported } from '../http/require-role';"],
    ['the domain itself', 'server/src/domain/station-scope.ts', "import { forbidden as imported } from '../http/errors';"],
  ])('refuses %s importing server/src/http', async (_what, file, line) => {
    const messages = await boundaryMessages(file, line);
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatch(HTTP_EDGE);
  });

  it.each([
    ['a service raising a domain error', 'server/src/modules/plans/plans.service.ts', "import { notFound as imported } from '../../domain/errors';"],
    ['a route file', 'server/src/modules/plans/plans.routes.ts', "import { parse as imported } from '../../http/validate';"],
    ['a payments route file', 'server/src/modules/payouts/public-payments.routes.ts', "import { requireRole as imported } from '../../http/require-role';"],
    ['the app', 'server/src/app.ts', "import { errorHandler as imported } from './http/error-handler';"],
    ['the process entry', 'server/src/main.ts', "import { createSessionSetup as imported } from './http/session';"],
    ['the edge itself', 'server/src/http/validate.ts', "import { badRequest as imported } from './errors';"],
  ])('lets %s through', async (_what, file, line) => {
    expect(await boundaryMessages(file, line)).toEqual([]);
  });
});

describe('money and features keep their existing boundaries', () => {
  it('refuses finance reading payouts except through payments/reader', async () => {
    expect(await boundaryMessages('server/src/modules/finance/scope.ts', "import { payoutRouter as imported } from '../payouts/payout.service';")).toEqual([
      'Finance reads money movements through server/src/modules/payments/reader only.',
    ]);
  });

  it('refuses one client feature importing another', async () => {
    const messages = await boundaryMessages('client/src/features/flight-desk/components/x.tsx', "import { imported } from '../../denials/api/denials';");
    expect(messages).toEqual(['A feature must not import another feature or the app; move shared code to lib/ or components/ui/.']);
  });
});
