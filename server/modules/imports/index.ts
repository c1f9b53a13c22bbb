// The public face of the imports module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { importsService } from './imports.service';
export { importsToResume, runImport } from './run-import';
export { sweepImportFiles } from './sweep-import-files';
