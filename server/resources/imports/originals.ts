import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';

/** SHA-256 of a file as lowercase hex, streamed: a 150 MB upload is never held in memory. */
export async function sha256OfFile(file: string): Promise<string> {
  const hash = crypto.createHash('sha256');
  await pipeline(fs.createReadStream(file, { highWaterMark: 1 << 20 }), hash);
  return hash.digest('hex');
}

/**
 * The kept original files of imports, under `<data dir>/originals/<yyyy>/<mm>/`. A file's
 * stored path is relative to the data folder, so the folder can be moved or restored elsewhere.
 */
export interface OriginalsStore {
  /**
   * Moves an uploaded file into the store as `originals/<yyyy>/<mm>/<importId>-<sha256>.csv`
   * (the month of `at`, UTC) and makes it read-only.
   * @returns its path relative to the data folder
   */
  keep(uploaded: string, original: { importId: string; sha256: string; at: Date }): Promise<string>;
  /** @returns the absolute path of a stored file, or null when it is not there (or not a file) */
  find(relativePath: string): Promise<string | null>;
  /** The absolute path of a stored file, for the import job to read. */
  absolute(relativePath: string): string;
}

/** @param originalsDir `<data dir>/originals` (services.originalsDir) */
export function originalsStore(originalsDir: string): OriginalsStore {
  const root = path.resolve(originalsDir);
  const dataDir = path.dirname(root);
  const folder = path.basename(root);
  const absolute = (relativePath: string) => {
    const resolved = path.resolve(dataDir, relativePath);
    // A stored path never leaves the originals folder; refuse one that would.
    if (!resolved.startsWith(root + path.sep)) throw new Error(`not a kept original: ${relativePath}`);
    return resolved;
  };
  return {
    async keep(uploaded, { importId, sha256, at }) {
      const yyyy = String(at.getUTCFullYear());
      const mm = String(at.getUTCMonth() + 1).padStart(2, '0');
      const relativePath = path.posix.join(folder, yyyy, mm, `${importId}-${sha256}.csv`);
      const target = absolute(relativePath);
      await fs.promises.mkdir(path.dirname(target), { recursive: true });
      // Never over an existing file (rename would replace one silently): a hard link, or a
      // copy when the upload folder is on another file system, both refuse an existing name.
      try {
        await fs.promises.link(uploaded, target).catch(async (err: NodeJS.ErrnoException) => {
          if (err.code !== 'EXDEV') throw err;
          await fs.promises.copyFile(uploaded, target, fs.constants.COPYFILE_EXCL);
        });
      } catch (err) {
        // The name is taken when the database was recreated beside a kept data folder (import ids
        // start again). The file there is kept as it is; it stands for this import only if it
        // holds the very bytes uploaded (both hashed here again, not taken from the name).
        if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
        const [there, here] = await Promise.all([sha256OfFile(target), sha256OfFile(uploaded)]);
        if (there !== here || here !== sha256) throw err;
      }
      await fs.promises.rm(uploaded, { force: true });
      await fs.promises.chmod(target, 0o444);
      return relativePath;
    },
    async find(relativePath) {
      const file = absolute(relativePath);
      const stat = await fs.promises.stat(file).catch(() => null);
      return stat?.isFile() ? file : null;
    },
    absolute,
  };
}
