// Public module of the admin feature: the outgoing-mail viewer's routes.
export { adminMailRouter } from './admin-mail.routes.ts';
