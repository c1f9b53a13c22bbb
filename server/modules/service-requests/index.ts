// The public face of the service-requests module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { serviceRequestsService } from './service-requests.service';
