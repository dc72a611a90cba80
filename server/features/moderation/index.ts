// Public module of the moderation feature: its routes.
export { moderationRouter } from './moderation.routes.ts';
export { recordAudit } from './moderation.service.ts';
