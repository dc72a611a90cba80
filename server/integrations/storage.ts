/**
 * Upload storage: photos and logos under DATA_DIR/uploads, with random names only (OWASP ASVS
 * 5.3.2: no user file names in paths). Every image is checked by its bytes (ASVS 5.2.2), its pixel
 * count is capped before decoding (ASVS 5.2.6, pixel floods) and it is re-encoded by sharp, so what
 * we store and serve is pixels we wrote, never the uploaded bytes. Nothing is written until every
 * check has passed: a refused file never reaches the disk.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { type NextFunction, type RequestHandler, type Response, Router } from 'express';
import { fileTypeFromBuffer } from 'file-type';
import multer from 'multer';
import sharp, { type Metadata, type OutputInfo } from 'sharp';
import { AppError, badRequest } from '../http/app-error.ts';

export const IMAGE_LIMITS = Object.freeze({
  maxBytes: 8 * 1024 * 1024,
  /** 40 megapixels: a 7,000 × 5,700 camera photo passes; a 30,000 × 30,000 "pixel flood" does not */
  maxPixels: 40_000_000,
  /** longest side we keep; larger photos are scaled down */
  maxSide: 2400,
  thumbSide: 480,
});
export const ALLOWED_IMAGE_MIME = ['image/jpeg', 'image/png', 'image/webp'] as const;

const unsupported = (message: string) => new AppError(415, 'unsupported_file', message);

export type StoredImage = { fileName: string; thumbName: string; mime: 'image/jpeg' | 'image/webp'; width: number; height: number; bytes: number };

/** The columns of an upload row that describe a stored image: its two files, type and size. */
export const storedImageColumns = (img: StoredImage) => ({ path: img.fileName, thumbPath: img.thumbName, mime: img.mime, width: img.width, height: img.height, bytes: img.bytes });

export type Storage = {
  dir: string;
  /** checks, re-encodes and writes an image and its WebP thumbnail; throws AppError when refused */
  saveImage(buf: Buffer): Promise<StoredImage>;
  remove(fileName: string): void;
};

const NAME = /^[a-f0-9]{32}(?:-t)?\.(?:webp|jpg)$/;

/** An image checked and re-encoded, not yet written: what the CPU-heavy half of saveImage makes. */
export type ProcessedImage = { main: Uint8Array; thumb: Uint8Array; jpeg: boolean; width: number; height: number };

/**
 * Checks an image by its bytes and re-encodes it (main size and WebP thumbnail). Pure CPU, no
 * disk: the server runs it in its worker pool (server/workers). Throws AppError when refused.
 */
export async function processImage(buf: Uint8Array): Promise<ProcessedImage> {
  if (buf.byteLength > IMAGE_LIMITS.maxBytes) throw new AppError(413, 'file_too_large', 'That file is larger than 8 MB.');
  const type = await fileTypeFromBuffer(buf);
  if (!type || !(ALLOWED_IMAGE_MIME as readonly string[]).includes(type.mime)) throw unsupported('That file is not a JPEG, PNG or WebP image (we check the file itself, not its name).');
  let meta: Metadata;
  try {
    // metadata() reads the header only, so the pixel count is known before anything is decoded
    // (no limit here, so an oversized header gets its own clear message below)
    meta = await sharp(buf, { limitInputPixels: false }).metadata();
  } catch {
    throw unsupported('That image could not be read.');
  }
  const w = meta.width ?? 0;
  const h = meta.height ?? 0;
  if (!w || !h) throw unsupported('That image could not be read.');
  if (w * h > IMAGE_LIMITS.maxPixels) throw new AppError(413, 'image_too_large', `That image is ${w} × ${h} pixels; the limit is ${IMAGE_LIMITS.maxPixels / 1_000_000} megapixels.`);

  const jpeg = type.mime === 'image/jpeg';
  let main: { data: Buffer; info: OutputInfo };
  let thumb: Buffer;
  try {
    const base = () => sharp(buf, { limitInputPixels: IMAGE_LIMITS.maxPixels, failOn: 'error' }).rotate();
    const resized = base().resize({ width: IMAGE_LIMITS.maxSide, height: IMAGE_LIMITS.maxSide, fit: 'inside', withoutEnlargement: true });
    // re-encoding drops metadata (EXIF location etc.): sharp keeps none unless asked
    main = await (jpeg ? resized.jpeg({ quality: 85, mozjpeg: true }) : resized.webp({ quality: 85 })).toBuffer({ resolveWithObject: true });
    thumb = await base().resize({ width: IMAGE_LIMITS.thumbSide, height: IMAGE_LIMITS.thumbSide, fit: 'inside', withoutEnlargement: true }).webp({ quality: 78 }).toBuffer();
  } catch {
    throw unsupported('That image is damaged or could not be read.');
  }
  return { main: main.data, thumb, jpeg, width: main.info.width, height: main.info.height };
}

const asBuffer = (u: Uint8Array) => (Buffer.isBuffer(u) ? u : Buffer.from(u.buffer, u.byteOffset, u.byteLength));

/**
 * `process` does the checking and re-encoding; by default in this thread, the server passes its
 * worker pool's (server/workers/pool.ts) so the request thread never decodes an image.
 */
export function createStorage(dir: string, opts: { process?: (buf: Uint8Array) => Promise<ProcessedImage> } = {}): Storage {
  const process = opts.process ?? processImage;
  return {
    dir,
    async saveImage(buf) {
      if (buf.byteLength > IMAGE_LIMITS.maxBytes) throw new AppError(413, 'file_too_large', 'That file is larger than 8 MB.');
      const img = await process(buf);
      const stem = crypto.randomBytes(16).toString('hex');
      const fileName = `${stem}.${img.jpeg ? 'jpg' : 'webp'}`;
      const thumbName = `${stem}-t.webp`;
      fs.mkdirSync(dir, { recursive: true });
      fs.writeFileSync(path.join(dir, fileName), asBuffer(img.main), { flag: 'wx' });
      fs.writeFileSync(path.join(dir, thumbName), asBuffer(img.thumb), { flag: 'wx' });
      return { fileName, thumbName, mime: img.jpeg ? 'image/jpeg' : 'image/webp', width: img.width, height: img.height, bytes: img.main.byteLength };
    },
    remove(fileName) {
      if (NAME.test(fileName)) fs.rmSync(path.join(dir, fileName), { force: true });
    },
  };
}

export const uploadUrl = (fileName: string | null | undefined): string | null => (fileName ? `/uploads/${fileName}` : null);

/**
 * Multer with memory storage: the bytes stay in memory until checked, so nothing refused is
 * written. One file per request, in the field `file`. Size errors become our error shape.
 */
export function singleFile(maxBytes: number, opts: { fieldSize?: number } = {}): RequestHandler {
  // text fields are 1 kB unless the route takes longer text with its file (a message, a review)
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: opts.fieldSize ?? 1024, parts: 10 } }).single('file');
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'file_too_large', `That file is larger than ${sizeLabel(maxBytes)}.`));
        return next(badRequest(`The upload could not be read (${err.code.toLowerCase().replace(/_/g, ' ')}).`));
      }
      return next(badRequest('The upload could not be read.'));
    });
  };
}

/** 8 MB, 512 kB: whole megabytes when the limit is one, else kilobytes (a 512 kB cap is not "1 MB") */
const sizeLabel = (bytes: number) => (bytes >= 1024 * 1024 && bytes % (1024 * 1024) === 0 ? `${bytes / 1024 / 1024} MB` : `${Math.round(bytes / 1024)} kB`);

/** Sends one stored image of `dir` by its random name: the right type, nosniff, and no script ever; 404 otherwise. */
export function sendStoredImage(res: Response, next: NextFunction, dir: string, name: string, cache: 'public' | 'private' = 'public'): void {
  if (!NAME.test(name)) {
    next(new AppError(404, 'not_found', 'No such file.'));
    return;
  }
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
  res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
  // a private image (an order message's photo) is never kept by shared caches
  if (cache === 'private') res.setHeader('Cache-Control', 'private, max-age=3600');
  res.sendFile(
    path.join(dir, name),
    {
      maxAge: cache === 'public' ? '365d' : undefined,
      immutable: cache === 'public',
      cacheControl: cache === 'public',
      dotfiles: 'deny',
      headers: { 'Content-Type': name.endsWith('.jpg') ? 'image/jpeg' : 'image/webp' },
    },
    (err) => {
      if (err && !res.headersSent) next(new AppError(404, 'not_found', 'No such file.'));
    },
  );
}

/** GET /uploads/<name>: only our own random names, the right type, nosniff, and no script ever. */
export function uploadsRouter(dir: string): Router {
  const r = Router();
  r.get('/:name', (req, res, next) => sendStoredImage(res, next, dir, req.params.name));
  return r;
}
