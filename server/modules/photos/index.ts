// The public face of the photos module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { processImage } from './process-image';
export { sweepOrphanObjects } from './sweep-orphan-objects';
export { photosService, type PhotoImage } from './photos.service';
export { sendPhoto } from './send-photo';
