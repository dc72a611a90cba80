/**
 * Import rules for Namesake, checked by `npm run lint` (dependency-cruiser). Why each rule exists is in
 * DEVELOPERS.md, "Conventions". TypeScript is read with @swc/core (`parser: 'swc'`): dependency-cruiser's
 * own TypeScript reader needs TypeScript's JavaScript API, which the native TypeScript 7 compiler
 * does not ship.
 */

// dependency-cruiser 17.4.3 hands every file to swc as plain TypeScript, so the first .tsx file with JSX
// stops the whole run (upstream: sverweij/dependency-cruiser issue 1081, fixed after 17.4.3). Until we
// upgrade, turn on swc's `tsx` switch for .tsx/.jsx files. dependency-cruiser reads parseFileSync from
// @swc/core's exports object on each call, so replacing it here is enough. Remove on upgrade.
const swc = require('@swc/core');
const parseFileSync = swc.parseFileSync;
swc.parseFileSync = (file, options) => parseFileSync(file, /\.[jt]sx$/.test(file) ? { ...options, syntax: 'typescript', tsx: true } : options);

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'no-circular',
      severity: 'error',
      comment: 'A cycle makes load order matter and hides which module owns a rule; break it by moving the shared part down.',
      from: {},
      to: { circular: true },
    },
    {
      name: 'client-feature-isolation',
      severity: 'error',
      comment: 'One client feature (src/features/<f>) may not import another: move what both need to src/components, src/lib or shared/, or compose the two features in a route under src/app.',
      from: { path: '^src/features/([^/]+)/' },
      to: { path: '^src/features/', pathNot: '^src/features/$1/' },
    },
    {
      name: 'server-feature-public-module',
      severity: 'error',
      comment: "Another server feature (or app code outside server/features/<f>) reaches a feature only through server/features/<f>/index.ts, its public module. Tests may import a feature's inside.",
      from: { pathNot: ['^server/features/[^/]+/', '^tests/'] },
      to: { path: '^server/features/[^/]+/', pathNot: '^server/features/[^/]+/index\\.ts$' },
    },
    {
      name: 'server-feature-public-module-between-features',
      severity: 'error',
      comment: "Inside server/features, one feature imports another only through that feature's index.ts (its public module).",
      from: { path: '^server/features/([^/]+)/' },
      to: { path: '^server/features/[^/]+/', pathNot: ['^server/features/$1/', '^server/features/[^/]+/index\\.ts$'] },
    },
    {
      name: 'database-calls-in-repos',
      severity: 'error',
      comment:
        'Every database call on the server is in a *.repo.ts: services, routes, jobs and the seed call a repo, so only repos import drizzle-orm or the tables (server/db/schema.ts). The schema, the client and the auth setup (better-auth reads the tables) are the exceptions.',
      from: { path: '^server/', pathNot: ['\\.repo\\.ts$', '^server/db/(schema|auth-schema|client)\\.ts$', '^server/auth\\.ts$'] },
      to: { path: ['^node_modules/drizzle-orm/', '^server/db/(schema|auth-schema)\\.ts$'] },
    },
    {
      name: 'services-never-see-http',
      severity: 'error',
      comment: 'A service takes plain values (the user, ids, parsed input), never Express requests or responses: cookies, headers and sessions are read in the route or in server/http/.',
      from: { path: '\\.service\\.ts$' },
      to: { path: '^node_modules/express/' },
    },
    {
      name: 'shared-stands-alone',
      severity: 'error',
      comment: 'shared/ is used by the browser and the server alike, so it never imports src/ or server/.',
      from: { path: '^shared/' },
      to: { path: '^(src|server)/' },
    },
    {
      name: 'client-and-server-meet-in-shared',
      severity: 'error',
      comment: 'The client and the server share code only through shared/: src/ never imports server/, nor server/ src/.',
      // from src/ to server/, or from server/ to src/ ($1 is the side the import starts from)
      from: { path: '^(src|server)/' },
      to: { path: '^(src|server)/', pathNot: '^$1/' },
    },
  ],
  options: {
    parser: 'swc',
    tsPreCompilationDeps: true,
    // our code, plus the two packages the database and HTTP rules above watch for
    includeOnly: '^(src|server|shared|tests|e2e|fakes|bench|scripts)/|^node_modules/(drizzle-orm|express)/',
    doNotFollow: { path: 'node_modules' },
    moduleSystems: ['es6', 'cjs'],
    enhancedResolveOptions: {
      extensions: ['.ts', '.tsx', '.mjs', '.js', '.cjs', '.json'],
      conditionNames: ['import', 'require', 'node', 'default', 'types'],
    },
    reporterOptions: {
      text: { highlightFocused: true },
    },
  },
};
