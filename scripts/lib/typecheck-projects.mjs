// Every TypeScript project of the repository, checked by `npm run typecheck` and by `npm test`.
export const TYPECHECK_PROJECTS = ['shared/tsconfig.json', 'server/tsconfig.json', 'test/tsconfig.json', 'apps/portal/tsconfig.app.json', 'apps/portal/tsconfig.spec.json'];
