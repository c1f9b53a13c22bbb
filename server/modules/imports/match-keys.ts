const STREET_WORDS: Record<string, string> = {
  street: 'st', avenue: 'ave', av: 'ave', road: 'rd', drive: 'dr', lane: 'ln', court: 'ct', place: 'pl', boulevard: 'blvd',
  terrace: 'ter', highway: 'hwy', parkway: 'pkwy', north: 'n', south: 's', east: 'e', west: 'w', apartment: 'apt', unit: 'apt',
};

/** "  O'Neil,  Pat " and "o neil pat" are one name: case, accents, punctuation and spacing do not tell records apart. */
export const nameKey = (text: string) =>
  text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();

/** "12 Elm Street" and "12 elm st." are one address (the usual postal abbreviations). */
export const addressKey = (text: string) =>
  nameKey(text)
    .split(' ')
    .map((w) => STREET_WORDS[w] ?? w)
    .join(' ');

export const serialKey = (text: string) => text.toLowerCase().replace(/[^a-z0-9]/g, '');
