import PrimeVue from 'primevue/config'

/** PrimeVue without a theme: components render and behave, no CSS is injected. */
export const withPrimeVue = { global: { plugins: [[PrimeVue, { theme: 'none' }]] as never[] } }
