// Public module of the materials feature: its routes.
export { materialsRouter } from './materials.routes.ts';
