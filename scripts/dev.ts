// `npm run dev`: the API under tsx watch on API_PORT (3001) and Vite with hot reload on 5173, proxying /api.
import { spawn } from 'node:child_process';

const apiPort = process.env.API_PORT ?? '3001';
const env = { ...process.env, NODE_ENV: 'development', PORT: apiPort, API_PORT: apiPort, APP_URL: 'http://localhost:5173' };
const children = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], { stdio: 'inherit', env }),
  spawn('npx', ['vite', '--host', '127.0.0.1'], { stdio: 'inherit', env }),
];
const stop = () => children.forEach((c) => c.kill('SIGTERM'));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
children.forEach((c) => c.on('exit', (code) => { stop(); process.exitCode = code ?? 0; }));
console.log('Tallyard dev: open http://localhost:5173 (API on port ' + apiPort + ')');
