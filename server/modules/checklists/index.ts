// The public face of the checklists module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { findTemplateFor } from './checklists.repository';
export { findDefaultChecklist } from './default-checklists';
export { seedCompanyChecklists } from './seed-checklists';
