// Shape of the session user carried by nuxt-auth-utils (sealed cookie).
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    siteRole: 'admin' | 'member'
  }
}
export {}
