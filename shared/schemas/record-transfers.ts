import { z } from 'zod';
import { storableText } from './common';
import { normalizeTransferCode } from '../transfers/transfer-code';

/**
 * Moving a life record to another company with the homeowner's consent.
 *   POST /appliances/:id/record-transfers             CreatedTransferDto  records:transfer (the code is shown once)
 *   POST /record-transfers/:id/withdraw               TransferDto         records:transfer
 *   POST /homeowner/appliances/:id/record-transfers   CreatedTransferDto  homeowner (own appliances only)
 *   POST /homeowner/record-transfers/:id/withdraw     TransferDto         homeowner
 *   POST /record-transfers/preview  { code }          TransferPreviewDto  records:transfer (the receiving company)
 *   POST /record-transfers/redeem   { code, siteId? } ReceivedTransferDto records:transfer
 * The code travels in the body, never in a URL, so it stays out of logs and history.
 */

export { TRANSFER_CODE_DAYS, TRANSFER_WHAT_IS_COPIED } from '../transfers/transfer-words';

export const TRANSFER_CODE_MESSAGE = 'Enter the 16-character code, for example 7K2M-Q9XD-4HPT-WB3C.';

export const transferCodeField = storableText('Enter the code.')
  .max(40, TRANSFER_CODE_MESSAGE)
  .transform((typed, ctx) => {
    const code = normalizeTransferCode(typed);
    if (!code) {
      ctx.addIssue({ code: 'custom', message: TRANSFER_CODE_MESSAGE });
      return z.NEVER;
    }
    return code;
  });

export const transferPreviewInput = z.object({ code: transferCodeField });
export const transferRedeemInput = z.object({
  code: transferCodeField,
  /** One of the receiving company's own sites; without it a new customer and site are made from the record. */
  siteId: z.uuid('Pick one of your sites.').optional(),
});
export type TransferRedeemInput = z.input<typeof transferRedeemInput>;

export type TransferStatus = 'open' | 'used' | 'withdrawn' | 'expired';
export type TransferDto = { id: string; status: TransferStatus; expiresAt: string; createdAt: string };
export type CreatedTransferDto = TransferDto & { code: string };

export type TransferPreviewDto = {
  senderName: string;
  appliance: { kind: string; label: string; manufacturer: string | null; model: string | null; installedOn: string | null };
  homeownerName: string;
  address: { street: string; town: string; postalCode: string | null };
  counts: { components: number; visits: number; partSwaps: number; photos: number };
  expiresAt: string;
};

export type ReceivedTransferDto = { applianceId: string; customerId: string; siteId: string; counts: TransferPreviewDto['counts'] };

/** Shown on a copied record and its visits: who recorded it, and when it arrived here. */
export type TransferProvenanceDto = { senderName: string; receivedAt: string };
