import type { Request, Response } from 'express';
import type { PhotoImage } from './photos.service';

const matchesEtag = (header: string | undefined, etag: string) =>
  Boolean(header) && header!.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etag || tag.trim() === '*');

/** Serves one photo variant with its ETag: 304 when the client already has these bytes, else the bytes. */
export async function sendPhoto(req: Request, res: Response, image: PhotoImage, cacheControl: string) {
  res.setHeader('Cache-Control', cacheControl);
  res.setHeader('ETag', image.etag);
  if (matchesEtag(req.headers['if-none-match'], image.etag)) return void res.status(304).end();
  const object = await image.load();
  res.setHeader('Content-Type', object.contentType ?? 'image/jpeg');
  res.setHeader('Content-Length', String(object.body.length));
  res.end(object.body);
}
