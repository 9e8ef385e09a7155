import { createApp } from 'vue'
import { createPinia } from 'pinia'
import PrimeVue from 'primevue/config'
import ToastService from 'primevue/toastservice'
import ConfirmationService from 'primevue/confirmationservice'
import '@fontsource/fira-sans/400.css'
import '@fontsource/fira-sans/500.css'
import '@fontsource/fira-sans/600.css'
import 'primeicons/primeicons.css'
import './assets/base.css'
import App from './App.vue'
import { DowndipPreset } from './assets/preset'
import { onUnauthorized } from './api/client'
import { applyStoredColorScheme, DARK_CLASS } from './composables/use-color-scheme'
import { router } from './router'
import { useAuthStore } from './stores/auth'

applyStoredColorScheme()

const app = createApp(App)
const pinia = createPinia()
app.use(pinia)
app.use(router)
app.use(PrimeVue, {
  theme: {
    preset: DowndipPreset,
    options: { darkModeSelector: `.${DARK_CLASS}`, cssLayer: false },
  },
})
app.use(ToastService)
app.use(ConfirmationService)

// The session ended on the server (expired, signed out elsewhere): back to sign-in, once.
onUnauthorized(() => {
  useAuthStore(pinia).clear()
  const current = router.currentRoute.value
  if (current.name !== 'sign-in') {
    void router.push({ name: 'sign-in', query: { redirect: current.fullPath } })
  }
})

app.mount('#app')
