// Entry of each worker thread of the pool (pool.ts). The server runs TypeScript through tsx, and
// vitest through its own loader; a worker thread starts as plain Node either way, so it registers
// tsx itself and then loads the task module. Its default export is what piscina calls per task.
import { register } from 'tsx/esm/api';

register();
const { runTask } = await import('./tasks.ts');

export default runTask;
