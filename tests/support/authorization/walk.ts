import crypto from 'node:crypto';
import request from 'supertest';
import type { Express } from 'express';
import type { AppContext } from '../../../server/context';
import type { Access } from '../../../server/lib/route';
import { checkTagCode, generateTagCode } from '../../../shared/tags/tag-code';
import type { Agent } from '../tenant';
import type { CallerId, Cell, RouteCase } from './cases';
import { expectedStatus, isCross } from './expected';
import { ghostOf, type World } from './world';

type Route = { method: 'get' | 'post' | 'put' | 'patch' | 'delete'; path: string; access: Access };
export type Answer = { status: number; code: string | null; text: string };
export type CellResult = { route: string; caller: CallerId; expected: number; got: number; problem: string | null };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const SHARE_TOKEN = /^[A-Za-z0-9_-]{43}$/;

/** The path with each `:param` filled from the case; a parameter the case does not map is an error. */
export function fillPath(path: string, params: Record<string, string>): string {
  return path.replace(/:([a-zA-Z]+)/g, (_m, name: string) => {
    if (!(name in params)) throw new Error(`no value for :${name}`);
    return encodeURIComponent(params[name]);
  });
}

/** Records made for a cell, as the ghost company would have them: every id one that exists nowhere. */
function ghostMade(made: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(made)) {
    if (typeof v !== 'string') out[k] = v;
    else if (UUID.test(v)) out[k] = crypto.randomUUID();
    else if (SHARE_TOKEN.test(v)) out[k] = crypto.randomBytes(32).toString('base64url');
    else if (checkTagCode(v).ok) out[k] = generateTagCode();
    else out[k] = v;
  }
  return out;
}

function textOf(res: request.Response): string {
  if (typeof res.text === 'string') return res.text;
  return Buffer.isBuffer(res.body) ? '' : JSON.stringify(res.body ?? '');
}

async function send(agent: Agent | ReturnType<typeof request>, route: Route, spec: RouteCase, cell: Cell): Promise<Answer> {
  const url = `/api${fillPath(route.path, spec.params?.(cell) ?? {})}`;
  let req = agent[route.method](url);
  const query = spec.query?.(cell);
  if (query) req = req.query(query);
  if (spec.upload) {
    const { fields, file, as = { field: 'files', filename: 'matrix.jpg', contentType: 'image/jpeg' } } = await spec.upload(cell);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    req = req.attach(as.field, file, { filename: as.filename, contentType: as.contentType });
  } else if (route.method !== 'get') {
    req = req.send(spec.body?.(cell) ?? {});
  }
  const res = await req;
  const code = typeof res.body === 'object' && res.body && !Buffer.isBuffer(res.body) ? ((res.body as { error?: { code?: string } }).error?.code ?? null) : null;
  return { status: res.status, code, text: textOf(res) };
}

export type Walkers = {
  ctx: AppContext;
  app: Express;
  a: World;
  b: World;
};

function agentFor(w: Walkers, caller: CallerId): Agent | ReturnType<typeof request> {
  switch (caller) {
    case 'signedOut':
    case 'linkHolder':
      return request(w.app);
    case 'otherManager':
      return w.b.as.manager;
    case 'otherHomeowner':
      return w.b.as.homeowner;
    default:
      return w.a.as[caller];
  }
}

function ownOf(w: Walkers, caller: CallerId): World | null {
  if (caller === 'signedOut') return null;
  return isCross(caller) ? w.b : w.a;
}

/**
 * One route against one caller: the answer must be the expected status, another company's caller must learn
 * nothing of the first company (none of its ids or names in the answer) and must get exactly what a made-up id
 * gets, and no refusal may carry data.
 */
export async function walkCell(w: Walkers, route: Route, spec: RouteCase, caller: CallerId): Promise<CellResult> {
  const key = `${route.method} ${route.path}`;
  const expected = expectedStatus(route, spec, caller);
  const own = ownOf(w, caller);
  const inTarget = (await spec.freshInTarget?.(w.ctx, w.a)) ?? {};
  const fresh = { ...inTarget, ...(await spec.freshInOwn?.(w.ctx, own)) };
  const cell: Cell = { target: w.a, own, fresh };
  let answer: Answer;
  try {
    answer = await send(agentFor(w, caller), route, spec, cell);
  } catch (err) {
    return { route: key, caller, expected, got: -1, problem: (err as Error).message };
  }
  const problems: string[] = [];
  if (answer.status !== expected) problems.push(`answered ${answer.status} ${answer.code ?? ''}`.trim());
  if (answer.status >= 400 && !answer.code) problems.push('a refusal without an error code');
  const leaked = isCross(caller) || answer.status >= 400 ? w.a.secrets.filter((s) => answer.text.includes(s)) : [];
  if (leaked.length) problems.push(`the answer shows ${leaked.length} of the first company's values`);

  if (isCross(caller)) {
    const ghost = ghostOf(w.a);
    const ghostFresh = { ...ghostMade(inTarget), ...(await spec.freshInOwn?.(w.ctx, own)) };
    const twin = await send(agentFor(w, caller), route, spec, { target: ghost, own, fresh: ghostFresh });
    if (twin.status !== answer.status || twin.code !== answer.code) problems.push(`a made-up id answers ${twin.status} ${twin.code ?? ''}, the real one ${answer.status} ${answer.code ?? ''}`);
  }
  return { route: key, caller, expected, got: answer.status, problem: problems.length ? problems.join('; ') : null };
}
