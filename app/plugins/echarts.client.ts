/**
 * <VChart> on the client only, as an async component: ECharts and vue-echarts (app/lib/echarts.ts,
 * about 0.9 MB) load the first time a page renders a chart, not with every page (sign-in and the
 * project list stay light; measured in tests/e2e/first-load.test.ts).
 */
import { defineAsyncComponent } from 'vue'

export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.vueApp.component('VChart', defineAsyncComponent(() => import('../lib/echarts').then(m => m.default)))
})
