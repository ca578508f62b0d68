// The session cookie holds who (id, name) and which session version; everything else is read
// from the database on each request.
declare module '#auth-utils' {
  interface User {
    id: number
    name: string
  }
  interface UserSession {
    sessionVersion: number
  }
}
export {}
