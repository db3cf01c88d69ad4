import type { Request } from 'express';
import type { StorageEngine } from 'multer';
import type { ContentStore } from '../store/content-store.js';

/** What the engine adds to `req.file`: the stored object's checksum. */
export interface StoredFileInfo {
  size: number;
  path: string;
  filename: string;
}

/**
 * A multer storage engine that streams the uploaded file straight into the content-addressed store
 * (no temporary copy, no memory buffer), refusing it past `maxBytes`. `req.file.filename` carries the
 * sha256. Nothing is removed on a later error: a stored object may be shared by other records.
 */
export function contentStoreEngine(store: ContentStore, maxBytes: number): StorageEngine {
  return {
    _handleFile(_req: Request, file, callback) {
      store.putStream(file.stream, { maxBytes }).then(
        (stored) => callback(null, { size: stored.size, filename: stored.sha256, path: store.pathOf(stored.sha256) } satisfies StoredFileInfo),
        (err: unknown) => {
          file.stream.resume();
          callback(err);
        },
      );
    },
    _removeFile(_req, _file, callback) {
      callback(null);
    },
  };
}
