/**
 * Why a part came out, as a part swap records it, and what that means for a service-life estimate.
 * Only a part removed because it wore out or failed ended its service life: that is an event at its age.
 * A part swapped for an upgrade or another reason, a part removed with its whole appliance (no swap), and a part
 * still in service are censored at their age: they lived at least that long (Kaplan & Meier 1958, §1).
 */
export const SWAP_CAUSES = ['wear_or_failure', 'upgrade', 'other'] as const;
export type SwapCause = (typeof SWAP_CAUSES)[number];

export const SWAP_CAUSE_LABELS: Record<SwapCause, string> = {
  wear_or_failure: 'Worn out or failed',
  upgrade: 'Upgrade (the old part still worked)',
  other: 'Other reason (the old part still worked)',
};

export const swapEndsServiceLife = (cause: SwapCause): boolean => cause === 'wear_or_failure';
