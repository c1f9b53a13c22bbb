// The public face of the reminders module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { unsubscribeUrls } from './deliver-reminders';
export { devOutboxEnabled } from './outbox.routes';
export { runRemindersForCompanies } from './reminders.service';
export { unsubscribeToken } from './unsubscribe-token';
