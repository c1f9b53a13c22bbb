// The public face of the visit-reports module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { SAFETY_NOTES } from './visit-report-content';
export { sendPdf } from './visit-reports.routes';
export { queueVisitReportMail } from './visit-reports.service';
