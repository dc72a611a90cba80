// Public module of the account feature: its routes (/api/me, opening a shop).
export { accountRouter } from './account.routes.ts';
export { getMe } from './account.service.ts';
