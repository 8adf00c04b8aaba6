import nodemailer from 'nodemailer'

export interface OutgoingMail {
  from: string
  to: { name: string; address: string }
  subject: string
  text: string
  html: string
  /** the same on every try of one outbox row, so a repeat can be recognised */
  messageId: string
}

/** Delivers one message or throws; the sender decides what a failure means. */
export interface MailTransport {
  send(mail: OutgoingMail): Promise<void>
  close(): void
}

/** nodemailer on an SMTP URL, with short limits so a silent server fails a try, not the sender. */
export function createSmtpTransport(url: string): MailTransport {
  const transporter = nodemailer.createTransport({
    url,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 20_000,
  })
  return {
    async send(mail) {
      await transporter.sendMail({
        from: mail.from,
        to: { name: mail.to.name, address: mail.to.address },
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        messageId: mail.messageId,
      })
    },
    close: () => transporter.close(),
  }
}
