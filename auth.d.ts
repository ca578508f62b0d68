// The session cookie holds who (id, name), which session version, and the random id of its row in
// the sessions table; everything else is read from the database on each request.
declare module '#auth-utils' {
  interface User {
    id: number
    name: string
  }
  interface UserSession {
    sessionVersion: number
    sid: string
  }
}
export {}
