// The server's API route table, made at build time by the 'nitro:init' hook in
// nuxt.config.ts (declared here so that every TypeScript project that reaches
// the route files through typed fetch sees it).
declare module '#plumbline/api-routes' {
  const routes: Array<{ route: string, method: string }>
  export default routes
}
