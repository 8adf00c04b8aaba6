import '@fontsource/merriweather-sans/400.css'
import '@fontsource/merriweather-sans/700.css'
import './theme/base.css'
import { createPinia } from 'pinia'
import PrimeVue from 'primevue/config'
import ConfirmationService from 'primevue/confirmationservice'
import ToastService from 'primevue/toastservice'
import { createApp } from 'vue'
import App from './App.vue'
import { router } from './router'
import { FractologPreset } from './theme/preset'

const app = createApp(App)
app.use(createPinia())
app.use(router)
app.use(PrimeVue, {
  theme: { preset: FractologPreset, options: { darkModeSelector: false, cssLayer: false } },
  ripple: false,
})
app.use(ToastService)
app.use(ConfirmationService)
app.mount('#app')
