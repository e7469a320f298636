// Registers the pledge drive's bulk-mail job handler in every instance (the shared job table runs it).
import { registerJobHandler } from '../services/jobs'
import { DRIVE_MAIL_JOB, sendDriveMail } from '../services/drives'

export default defineNitroPlugin(() => {
  registerJobHandler<{ mailingId: number; pledgeId: number }>(DRIVE_MAIL_JOB, (payload) => sendDriveMail(payload))
})
