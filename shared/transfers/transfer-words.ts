/** How long a transfer code can be used (common practice for a one-time hand-over code: two weeks). */
export const TRANSFER_CODE_DAYS = 14;

export const TRANSFER_WHAT_IS_COPIED =
  'The receiving company gets a copy of this life record: the appliance, its parts, the completed visits with their readings and outcomes, the part swaps and the photos the homeowner can see. Office notes stay here. This company keeps its own copy.';
