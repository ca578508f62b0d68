// Without SMTP_URL, start the local mail catcher with the server (loopback, a free port), so the
// first mail does not wait for it; stop it on shutdown. Say at once when mailed links are off.
export default defineNitroPlugin((nitroApp) => {
  if (!configuredPublicOrigin()) console.error(`[gammaboard] ${PUBLIC_URL_MISSING}`)
  if (!process.env.SMTP_URL) {
    useMail()
      .then(({ catcher }) => console.info(`[gammaboard] mail catcher on 127.0.0.1:${catcher?.port}`))
      .catch(error => console.error('[gammaboard] mail catcher failed to start:', error))
  }
  nitroApp.hooks.hook('close', closeMail)
})
