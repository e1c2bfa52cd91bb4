// The signed-in user kept in the sealed session cookie. The role here is only
// for the pages; the server reloads the user from the database on every request.
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: 'admin' | 'qa' | 'owner' | 'viewer'
  }
}

export {}
