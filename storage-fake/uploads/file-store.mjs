// Persistent index (index.json) and file bodies under <dataDir>/files/<key>; disk is the source
// of truth, cached by stat, so a removed folder reads as empty and is recreated on demand.

import { randomBytes } from "node:crypto";
import { mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";

export class FileStore {
  /** @param {string} dataDir */
  constructor(dataDir) {
    this.dataDir = dataDir;
    this.indexPath = join(dataDir, "index.json");
    this.filesDir = join(dataDir, "files");
    this.tmpDir = join(dataDir, "tmp");
    /** @type {{stamp: string, data: {version: number, files: any[]}} | null} */
    this.cache = null;
  }

  ensureDirs() {
    mkdirSync(this.filesDir, { recursive: true });
    mkdirSync(this.tmpDir, { recursive: true });
  }

  filePath(key) {
    return join(this.filesDir, key);
  }

  tmpPath() {
    this.ensureDirs();
    return join(this.tmpDir, `${Date.now()}-${randomBytes(6).toString("hex")}.part`);
  }

  /** @returns {{version: number, files: any[]}} */
  load() {
    let st;
    try {
      st = statSync(this.indexPath);
    } catch {
      this.cache = null;
      return { version: 1, files: [] };
    }
    const stamp = `${st.mtimeMs}:${st.size}:${st.ino}`;
    if (this.cache && this.cache.stamp === stamp) return structuredClone(this.cache.data);
    try {
      const data = JSON.parse(readFileSync(this.indexPath, "utf8"));
      if (!data || !Array.isArray(data.files)) throw new Error("no files array");
      this.cache = { stamp, data };
      return structuredClone(data);
    } catch (err) {
      process.stderr.write(
        `[uploads-fake] ignoring unreadable ${this.indexPath}: ${err.message}\n`,
      );
      return { version: 1, files: [] };
    }
  }

  save(data) {
    mkdirSync(this.dataDir, { recursive: true });
    const tmp = `${this.indexPath}.${process.pid}.tmp`;
    writeFileSync(tmp, JSON.stringify(data, null, 1));
    renameSync(tmp, this.indexPath);
    const st = statSync(this.indexPath);
    this.cache = { stamp: `${st.mtimeMs}:${st.size}:${st.ino}`, data: structuredClone(data) };
  }

  /** Synchronous read-modify-write (atomic within the event loop). */
  mutate(fn) {
    const data = this.load();
    const result = fn(data);
    this.save(data);
    return result;
  }

  all() {
    return this.load().files;
  }

  findByKey(key) {
    return this.all().find((f) => f.key === key) ?? null;
  }

  /** Resolve `{fileKey}` or `{customId}` to a record. */
  find(ref) {
    const files = this.all();
    if (ref.fileKey != null) return files.find((f) => f.key === ref.fileKey) ?? null;
    if (ref.customId != null) {
      for (let i = files.length - 1; i >= 0; i--)
        if (files[i].customId === ref.customId) return files[i];
    }
    return null;
  }

  /** Move a finished temp file into place and record it. */
  commit(tmpPath, record) {
    this.ensureDirs();
    renameSync(tmpPath, this.filePath(record.key));
    this.mutate((data) => {
      data.files = data.files.filter((f) => f.key !== record.key);
      data.files.push(record);
    });
  }

  removeKeys(keys) {
    const wanted = new Set(keys);
    let removed = [];
    this.mutate((data) => {
      removed = data.files.filter((f) => wanted.has(f.key));
      data.files = data.files.filter((f) => !wanted.has(f.key));
    });
    for (const f of removed) rmSync(this.filePath(f.key), { force: true });
    return removed.length;
  }
}
