/**
 * Test support: Debian's Mosquitto 2 on a free loopback port with a generated configuration —
 * a password file (mosquitto_passwd -b), ACLs that keep each device to its own site's topics
 * (`tallyrun/<site code>/#`, as server/ingest/parse-payload.ts reads topics) and let the ingest
 * user read them, alone or through a shared subscription (`$share/<group>/tallyrun/#`). Persistence
 * is off: sessions live in the broker's memory for as long as it runs, which is what the tests need.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

export const mosquittoPath = '/usr/sbin/mosquitto';

export interface MosquittoDevice {
  username: string;
  password: string;
  siteCode: string;
}

export interface Mosquitto {
  port: number;
  url: string;
  /** Everything the broker logged (its log goes to stderr). */
  log: string[];
  /** Rewrites the password and ACL files for these devices and has the broker reload them (SIGHUP). */
  allow(devices: MosquittoDevice[]): Promise<void>;
  stop(): Promise<void>;
}

/** A port free on loopback right now (the kernel's choice, released before the broker binds it). */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** The ACL file: the ingest user reads every site, each device writes only under its own site. */
export function aclFile(ingestUser: string, devices: MosquittoDevice[]): string {
  const lines = [`user ${ingestUser}`, 'topic read tallyrun/#', 'topic read $share/+/tallyrun/#', ''];
  for (const d of devices) lines.push(`user ${d.username}`, `topic write tallyrun/${d.siteCode}/#`, '');
  return lines.join('\n');
}

export async function startMosquitto(options: {
  ingest: { username: string; password: string };
  devices: MosquittoDevice[];
}): Promise<Mosquitto> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-mosquitto-'));
  const passwd = path.join(dir, 'passwd');
  const writeAccess = (devices: MosquittoDevice[]) => {
    fs.writeFileSync(passwd, '', { mode: 0o600 });
    for (const user of [options.ingest, ...devices])
      execFileSync('mosquitto_passwd', ['-b', passwd, user.username, user.password]);
    fs.writeFileSync(path.join(dir, 'acl'), aclFile(options.ingest.username, devices));
  };
  writeAccess(options.devices);
  const port = await freePort();
  fs.writeFileSync(
    path.join(dir, 'mosquitto.conf'),
    [
      `listener ${port} 127.0.0.1`,
      // Started as root, Mosquitto would switch to the user `mosquitto`, who cannot read this private folder.
      ...(process.getuid?.() === 0 ? ['user root'] : []),
      'allow_anonymous false',
      `password_file ${passwd}`,
      `acl_file ${path.join(dir, 'acl')}`,
      'persistence false',
      // Messages waiting for an absent member of a persistent session: far more than a test sends.
      'max_queued_messages 1000000',
      'log_dest stderr',
      'log_type error',
      'log_type warning',
      'log_type notice',
      'log_type information',
      '',
    ].join('\n'),
  );
  const log: string[] = [];
  const child: ChildProcess = spawn(mosquittoPath, ['-c', path.join(dir, 'mosquitto.conf')], {
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const collect = (chunk: Buffer) => log.push(...chunk.toString('utf8').split('\n').filter(Boolean));
  child.stdout!.on('data', collect);
  child.stderr!.on('data', collect);
  const ended = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  // Ready once the port answers; a ceiling, not a wait.
  const until = Date.now() + 15_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`mosquitto ended at start:\n${log.join('\n')}`);
    const open = await new Promise<boolean>((resolve) => {
      const socket = net.connect(port, '127.0.0.1', () => {
        socket.end();
        resolve(true);
      });
      socket.once('error', () => resolve(false));
    });
    if (open) break;
    if (Date.now() > until) throw new Error(`mosquitto did not listen on ${port}:\n${log.join('\n')}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    port,
    url: `mqtt://127.0.0.1:${port}`,
    log,
    async allow(devices) {
      writeAccess(devices);
      const reloads = log.length;
      child.kill('SIGHUP');
      // The broker logs the reload; a ceiling, not a wait.
      const until = Date.now() + 10_000;
      while (!log.slice(reloads).some((line) => /reload/i.test(line)) && Date.now() < until)
        await new Promise((r) => setTimeout(r, 50));
    },
    async stop() {
      if (child.exitCode === null) {
        child.kill('SIGTERM');
        await ended;
      }
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
