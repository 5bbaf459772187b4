// The compute pool's worker under tsx (tests, `npm run dev`): loads the TypeScript task module. The bundled
// server (dist-server/) starts dist-server/compute-task.js instead, with no TypeScript to load.
import { tsImport } from 'tsx/esm/api';

const task = await tsImport('./compute-task.ts', import.meta.url);
export default task.default;
