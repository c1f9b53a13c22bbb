/** The signed-in person and sign-in/out, shared by every feature (like bulletproof-react's lib/auth). */
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MeDto } from '@shared/schemas/me';
import { endSession } from '@/lib/offline/offline-session';

export async function getMe(): Promise<MeDto | null> {
  const me = await api<MeDto | { user: null }>('/me');
  return me.user ? (me as MeDto) : null;
}

export const meQueryOptions = () => queryOptions({ queryKey: ['me'], queryFn: getMe, staleTime: 60_000 });

export const useMe = () => useQuery(meQueryOptions());

export type SignInInput = { email: string; password: string };

// better-auth's HTTP endpoints, called directly so its client library stays out of the bundle.
export const signIn = (input: SignInInput) => api<unknown>('/auth/sign-in/email', { method: 'POST', body: input });
export const signOut = () => api<unknown>('/auth/sign-out', { method: 'POST', body: {} });

export type SignInLinkRequest = { email: string; callbackURL: string; errorCallbackURL?: string; invitationId?: string };

/**
 * Asks for a one-time sign-in link by e-mail. The server answers the same whether or not it sent one (it sends only to
 * invited or known addresses), so the screen can only say "if this address may sign in, a link is on its way".
 */
export const requestSignInLink = ({ invitationId, ...body }: SignInLinkRequest) =>
  api<{ status: boolean }>('/auth/sign-in/magic-link', { method: 'POST', body: { ...body, ...(invitationId ? { metadata: { invitationId } } : {}) } });

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: () => qc.invalidateQueries({ queryKey: ['me'] }) });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // Nothing of this person stays on the phone: the screens' cache, the saved records, the outbox and the drafts.
    onSuccess: async () => {
      qc.clear();
      await endSession();
    },
  });
}
