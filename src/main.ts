// Boot: Vue, Pinia, the router and the service worker. Nothing else happens here.
import { createApp } from 'vue'
import { createPinia } from 'pinia'
import { Locale } from 'vant'
import enUS from 'vant/es/locale/lang/en-US'
import App from './App.vue'
import { registerServiceWorker } from './pwa/registerServiceWorker'
import { router } from './router'
import { usePwaStore } from './stores/pwa'
import './styles/fonts.css'
import './styles/base.css'

// Vant's built-in texts (pagination, pickers, dialogs) in English.
Locale.use('en-US', enUS)

const app = createApp(App)
app.use(createPinia())
app.use(router)
registerServiceWorker(usePwaStore())
app.mount('#app')
