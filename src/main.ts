import { createApp } from 'vue'
import { createPinia } from 'pinia'
import '@fontsource/noto-sans/latin-400.css'
import '@fontsource/noto-sans/latin-700.css'
import './assets/base.css'
import App from './App.vue'
import { router } from './router'

createApp(App).use(createPinia()).use(router).mount('#app')
