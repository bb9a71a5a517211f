/** What a template produces: ready for `Mailer.sendMail` together with a recipient. */
export interface EmailContent {
  subject: string;
  text: string;
  html: string;
}
