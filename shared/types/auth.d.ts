// The sealed session cookie holds only ids and the role (it is capped at 4 KB).
declare module '#auth-utils' {
  interface User {
    id: number
    role: 'admin' | 'member'
    /** Random session id; its SHA-256 names the row in the sessions table. */
    sid: string
  }
}
export {}
