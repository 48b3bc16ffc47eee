// The sealed session cookie holds only ids and the role (it is capped at 4 KB).
declare module '#auth-utils' {
  interface User {
    id: number
    role: 'admin' | 'member'
    /** The user's session version when signing in; a reset or a disable bumps it. */
    sv: number
  }
}
export {}
