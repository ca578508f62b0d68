import VueKonva from 'vue-konva'

// Konva needs a DOM canvas: register it on the client only and wrap stages in <ClientOnly>.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.vueApp.use(VueKonva)
})
