// Marks <html data-hydrated> once Vue has taken over the server-rendered page.
// Before that a click on a form button is a plain HTML submission that the app
// never sees; browser tests wait for the mark before they act on a page.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.hook('app:suspense:resolve', () => {
    document.documentElement.dataset.hydrated = 'true'
  })
})
