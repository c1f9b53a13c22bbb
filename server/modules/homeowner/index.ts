// The public face of the homeowner module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { buildHomeownerView } from './homeowner-view';
export { requireOwnAppliance } from './own-appliance';
