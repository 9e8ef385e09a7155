import type { ProjectRole } from '../../../schema/index'

/** Subject, plain text and simple HTML of one mail; the wording is ours and kept short. */
export interface MailContent {
  subject: string
  text: string
  html: string
}

/** Shown only in mails about results (reviews, summaries), never in account mails. */
export const CAUTION =
  'Results are aids to professional judgement: they must be checked by a competent person, ' +
  'and local codes, standards and licensed practice govern design.'

const SIGNATURE = '— Downdip'

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)
}

function compose(subject: string, paragraphs: string[], link?: string, caution = false) {
  const text = [...paragraphs, ...(link ? [link] : []), ...(caution ? [CAUTION] : []), SIGNATURE]
  const html = [
    ...paragraphs.map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`),
    ...(link ? [`<p><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`] : []),
    ...(caution ? [`<p style="color:#555;font-size:90%">${escapeHtml(CAUTION)}</p>`] : []),
    `<p>${SIGNATURE}</p>`,
  ]
  return { subject, text: text.join('\n\n') + '\n', html: html.join('\n') }
}

export function invitationMail(input: {
  inviterName: string
  projectName: string | null
  role: ProjectRole | null
  link: string
  hours: number
}): MailContent {
  const where = input.projectName
    ? `to join the project "${input.projectName}" as ${input.role}`
    : 'to join Downdip'
  return compose(
    input.projectName ? `Join ${input.projectName} on Downdip` : 'Your Downdip account',
    [
      `${input.inviterName} has invited you ${where}.`,
      `Open the link below to choose your password. It works once, within ${input.hours} hours.`,
    ],
    input.link,
  )
}

export function resetMail(input: { name: string; link: string; minutes: number }): MailContent {
  return compose(
    'Choose a new Downdip password',
    [
      `Hello ${input.name},`,
      `Someone (we hope you) asked to reset the password of your Downdip account. ` +
        `Open the link below within ${input.minutes} minutes to choose a new one; it works once.`,
      'If you did not ask for this, ignore this mail: your password stays as it is.',
    ],
    input.link,
  )
}

/** A project notification; these concern results, so they carry the caution line. */
export function notificationMail(input: {
  projectName: string
  subject: string
  text: string
  link?: string
}): MailContent {
  return compose(`[${input.projectName}] ${input.subject}`, [input.text], input.link, true)
}
