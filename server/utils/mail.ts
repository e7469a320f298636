import nodemailer, { type Transporter } from 'nodemailer'

let transporter: Transporter | undefined

/** nodemailer over SMTP: the fake on loopback in development and tests, any SMTP host in production. */
export function useMailer(): Transporter {
  if (!transporter) {
    const url = useRuntimeConfig().smtpUrl
    if (!url) throw createError({ status: 503, message: 'E-mail is not configured (NUXT_SMTP_URL)' })
    transporter = nodemailer.createTransport(url)
  }
  return transporter
}

export interface Mail {
  to: string
  subject: string
  text: string
  html?: string
  headers?: Record<string, string>
}

export async function sendMail(mail: Mail) {
  const from = useRuntimeConfig().mailFrom
  return useMailer().sendMail({ from, ...mail })
}

/** Absolute link into the app for e-mails. */
export function appLink(path: string): string {
  return new URL(path, useRuntimeConfig().appUrl).toString()
}
