// Public module of the uploads feature: its routes.
export { uploadsApiRouter } from './uploads.routes.ts';
