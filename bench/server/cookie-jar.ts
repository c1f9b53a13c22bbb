/** The cookies one browser holds for the app: set by each answer, sent with each request, as a browser would. */
export class CookieJar {
  private readonly cookies = new Map<string, string>();

  constructor(header = '') {
    for (const pair of header.split('; ').filter(Boolean)) this.cookies.set(pair.slice(0, pair.indexOf('=')), pair);
  }

  header(): string {
    return [...this.cookies.values()].join('; ');
  }

  take(res: Response) {
    for (const set of res.headers.getSetCookie()) {
      const [pair, ...attributes] = set.split(';').map((s) => s.trim());
      const name = pair.slice(0, pair.indexOf('='));
      const value = pair.slice(name.length + 1);
      const expired = attributes.some((a) => /^max-age=(0|-\d+)$/i.test(a)) || value === '';
      if (expired) this.cookies.delete(name);
      else this.cookies.set(name, pair);
    }
  }
}
