import { describe, expect, it } from 'vitest';
import { MAX_PHOTO_BYTES } from '@shared/schemas/photos';
import { namedUniquely, rejectionsFrom, savedSummary, splitOversized } from '@/features/photos/lib/upload-batch';

const file = (name: string, bytes = 10) => new File([new Uint8Array(bytes)], name, { type: 'image/jpeg' });

describe('upload batching', () => {
  it('numbers repeated names so each refusal points at one file', () => {
    expect(namedUniquely([file('image.jpg'), file('image.jpg'), file('')]).map((i) => i.name)).toEqual(['image.jpg', 'image (2).jpg', 'photo.jpg']);
  });

  it('refuses a file over the limit on the phone, before sending', () => {
    const items = namedUniquely([file('small.jpg'), file('big.jpg', MAX_PHOTO_BYTES + 1)]);
    const { fits, rejected } = splitOversized(items);
    expect(fits.map((i) => i.name)).toEqual(['small.jpg']);
    expect(rejected).toEqual([{ name: 'big.jpg', message: `This photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB.` }]);
  });

  it('matches the server’s refused files to the files sent, by name, without parsing its sentences', () => {
    const items = namedUniquely([file('a: b.jpg'), file('fine.jpg')]);
    const { rejected, other } = rejectionsFrom({ files: [{ file: 'a: b.jpg', reason: 'Send a JPEG, PNG or WebP photo.' }, { file: 'ghost.jpg', reason: 'Damaged.' }] }, items);
    expect(rejected).toEqual([{ name: 'a: b.jpg', message: 'Send a JPEG, PNG or WebP photo.' }]);
    expect(other).toEqual(['ghost.jpg: Damaged.']);
  });

  it('keeps a message about the files as a whole', () => {
    expect(rejectionsFrom({ details: { files: ['Add at least one photo.'] } }, [])).toEqual({ rejected: [], other: ['Add at least one photo.'] });
  });

  it('says how many were saved and how many were there already', () => {
    const photo = (duplicate: boolean) => ({ duplicate }) as never;
    expect(savedSummary({ status: 201, photos: [photo(false), photo(false)] } as never)).toBe('2 photos saved.');
    expect(savedSummary({ status: 201, photos: [photo(false), photo(true)] } as never)).toBe('1 photo saved; 1 already on the record.');
    expect(savedSummary({ status: 200, photos: [photo(true)] } as never)).toBe('Already saved: this photo was on the record already.');
  });
});
