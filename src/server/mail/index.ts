// The app's e-mail: compose a message with a template, then queueMail (stored, sent in the background,
// retried) or sendMail (stored, first attempt awaited). Example, from a route handler:
//   await queueMail({ to: address, ...commentNoticeMail({ kitName, authorName, body, url: publicUrl(path) }) });
export { queueMail, sendMail, mailStates, deliverDueMail, ensureOutboxWorker, type OutgoingMail, type MailState } from "./outbox";
export { commentNoticeMail, escapeHtml, invitationMail, publicUrl, resetPasswordMail, verifyAddressMail, type MailContent } from "./templates";
