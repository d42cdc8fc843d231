export { volunteerConfirmation, type VolunteerConfirmationInput } from './volunteer-confirmation';
export { rebookingNotice, type RebookingNoticeInput, type RebookingReason } from './rebooking-notice';
export { CAUTION, type Notice } from './notice';
export { escapeHtml, formatLocalDateTime, formatMoneyMinor } from './format';
