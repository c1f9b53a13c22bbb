/**
 * A homeowner's request to book a service visit, from the share page or the signed-in homeowner view.
 */
export const SERVICE_REQUEST_VIAS = ['share_link', 'homeowner_account'] as const;
export type ServiceRequestVia = (typeof SERVICE_REQUEST_VIAS)[number];
export const SERVICE_REQUEST_STATUSES = ['new', 'scheduled', 'closed'] as const;
export type ServiceRequestStatus = (typeof SERVICE_REQUEST_STATUSES)[number];
