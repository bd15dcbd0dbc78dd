// Where the fake keeps uploaded (already sanitised) images: one file per asset plus an
// index.json, so `npm run fakes` keeps photos across restarts when pointed at a fixed
// directory. Files are named by asset id, never by public_id, so a public_id can never
// name a path outside the data directory.

import fs from "node:fs/promises";
import path from "node:path";
import type { AcceptedImageFormat } from "../../media/image-limits";

export interface StoredAsset {
  asset_id: string;
  public_id: string;
  version: number;
  version_id: string;
  signature: string;
  width: number;
  height: number;
  format: AcceptedImageFormat;
  bytes: number;
  etag: string;
  created_at: string;
  tags: string[];
  original_filename: string;
  asset_folder: string;
  /** Name of the image file inside the data directory. */
  file: string;
}

const INDEX_FILE = "index.json";

export class AssetStore {
  private readonly assets = new Map<string, StoredAsset>();
  // Writes are chained so two uploads finishing together cannot interleave index writes.
  private writing: Promise<void> = Promise.resolve();

  private constructor(readonly dir: string) {}

  static async open(dir: string): Promise<AssetStore> {
    await fs.mkdir(dir, { recursive: true });
    const store = new AssetStore(dir);
    try {
      const saved = JSON.parse(await fs.readFile(path.join(dir, INDEX_FILE), "utf8")) as StoredAsset[];
      for (const asset of saved) store.assets.set(asset.public_id, asset);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== "ENOENT") throw err;
    }
    return store;
  }

  get(publicId: string): StoredAsset | undefined {
    return this.assets.get(publicId);
  }

  has(publicId: string): boolean {
    return this.assets.has(publicId);
  }

  /** A read-only view for tests and the status page. */
  view(): ReadonlyMap<string, StoredAsset> {
    return this.assets;
  }

  async read(asset: StoredAsset): Promise<Buffer> {
    return fs.readFile(path.join(this.dir, asset.file));
  }

  async put(asset: StoredAsset, data: Buffer): Promise<void> {
    await fs.writeFile(path.join(this.dir, asset.file), data);
    const previous = this.assets.get(asset.public_id);
    this.assets.set(asset.public_id, asset);
    await this.saveIndex();
    if (previous && previous.file !== asset.file) await fs.rm(path.join(this.dir, previous.file), { force: true });
  }

  async remove(publicId: string): Promise<StoredAsset | undefined> {
    const asset = this.assets.get(publicId);
    if (!asset) return undefined;
    this.assets.delete(publicId);
    await this.saveIndex();
    await fs.rm(path.join(this.dir, asset.file), { force: true });
    return asset;
  }

  private saveIndex(): Promise<void> {
    const next = this.writing.then(async () => {
      const tmp = path.join(this.dir, `${INDEX_FILE}.${process.pid}.tmp`);
      await fs.writeFile(tmp, JSON.stringify([...this.assets.values()], null, 2));
      await fs.rename(tmp, path.join(this.dir, INDEX_FILE));
    });
    this.writing = next.catch(() => {});
    return next;
  }
}
