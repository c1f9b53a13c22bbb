/**
 * What a share link that no longer opens says, by why: the company withdrew it, or its time ran out. Both tell the
 * household whom to ask for a new one, and neither says anything about the appliance.
 */
export const SHARE_LINK_GONE_CODES = { revoked: 'share_link_revoked', expired: 'share_link_expired' } as const;
export type ShareLinkGoneCode = (typeof SHARE_LINK_GONE_CODES)[keyof typeof SHARE_LINK_GONE_CODES];

type Company = { name: string; phone: string } | null | undefined;

const askFor = (company: Company) =>
  company?.name && company.phone ? `ask ${company.name} for a new link: call ${company.phone}.` : 'ask your service company for a new link.';

export function shareLinkGoneMessage(why: keyof typeof SHARE_LINK_GONE_CODES, company: Company): string {
  const who = company?.name || 'Your service company';
  return why === 'revoked'
    ? `${who} withdrew this link, so the record is no longer shared through it. To see it again, ${askFor(company)}`
    : `This link has expired. To see the record again, ${askFor(company)}`;
}

/** The page's heading for each. */
export const SHARE_LINK_GONE_TITLES: Record<ShareLinkGoneCode, string> = {
  share_link_revoked: 'This link was withdrawn',
  share_link_expired: 'This link has expired',
};
