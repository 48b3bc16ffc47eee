// A physically or semantically invalid request (API.md: 422). The message starts with the field path.
export class PhysicsError extends Error {
  status = 422
  constructor(public field: string, message: string) {
    super(message.startsWith(field) ? message : `${field}: ${message}`)
    this.name = 'PhysicsError'
  }
}
