// The public face of the record-transfers module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { transferProvenance } from './transfer-provenance';
