// The public face of the customers module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { toCustomerDto } from './customers.service';
