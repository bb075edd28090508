// Runs the local fake SMTP server on SMTP_HOST:SMTP_PORT, storing every message as JSON under
// ${DATA_DIR}/mailbox/ (shown by GET /api/mailbox in demo mode). Stops on SIGTERM/SIGINT.
import { loadConfig } from '../server/config'
import { mailboxDir } from '../server/mail/mailbox'
import { startFakeSmtp } from '../server/mail/fakeSmtp'

const config = loadConfig()
const dir = mailboxDir(config.dataDir)
try {
  const smtp = await startFakeSmtp({
    host: config.smtp.host,
    port: config.smtp.port,
    mailboxDir: dir,
    onMessage: (m) => console.log(`fake SMTP: caught "${m.subject}" for ${m.to}`),
  })
  console.log(`Fake SMTP listening on ${smtp.host}:${smtp.port}, mailbox ${dir}`)
  const stop = () => {
    smtp.close().finally(() => process.exit(0))
  }
  process.on('SIGTERM', stop)
  process.on('SIGINT', stop)
} catch (err) {
  console.error(
    `Fake SMTP could not start on ${config.smtp.host}:${config.smtp.port}:`,
    (err as Error).message,
  )
  process.exit(1)
}
