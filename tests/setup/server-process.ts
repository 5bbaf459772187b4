import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';

/** A free loopback port: the server's auth origin must name the real port, so PORT=0 will not do. */
export async function freePort(): Promise<number> {
  const srv = createServer();
  await new Promise<void>((resolve) => srv.listen(0, '127.0.0.1', resolve));
  const { port } = srv.address() as { port: number };
  await new Promise<void>((resolve) => srv.close(() => resolve()));
  return port;
}

export type ServerProcess = {
  child: ChildProcess;
  url: string;
  exited: Promise<number | null>;
  output: () => string;
};

/** The server from its sources under tsx; the benchmarks start the built one (`dist-server/index.js`). */
export const SOURCE_SERVER = ['--import', 'tsx', 'server/index.ts'];

/** The real server (`node --import tsx server/index.ts`) on this data folder; resolves once it listens. */
export async function startServerProcess(
  dataDir: string,
  port: number,
  env: Record<string, string> = {},
  nodeArgs = SOURCE_SERVER,
): Promise<ServerProcess> {
  const child = spawn(process.execPath, nodeArgs, {
    env: {
      ...process.env,
      DATA_DIR: dataDir,
      PORT: String(port),
      HOST: '127.0.0.1',
      LOG_LEVEL: 'info',
      NODE_ENV: 'test',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const exited = new Promise<number | null>((resolve) => child.on('exit', resolve));
  await new Promise<void>((resolve, reject) => {
    const onData = (d: Buffer) => {
      output += String(d);
      if (output.includes('listening')) resolve();
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    void exited.then((code) => reject(new Error(`the server exited (${code}) before listening:\n${output}`)));
  });
  return { child, url: `http://127.0.0.1:${port}`, exited, output: () => output };
}

/** Signs in through the HTTP API and returns the cookie header for later requests. */
export async function signInCookie(url: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: url },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}
