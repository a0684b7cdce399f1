import { createApp } from 'vue';
import { z } from 'zod';
import { createPinia } from 'pinia';
import { VueQueryPlugin } from '@tanstack/vue-query';
import '@fontsource/open-sans/400.css';
import '@fontsource/open-sans/600.css';
import '@fontsource/open-sans/700.css';
import './styles/theme.css';
import './styles/base.css';
import './styles/lists.css';
import App from './App.vue';
import { queryClient } from './api/queryClient';
import { i18n } from './i18n';
import { router } from './router';

// The CSP allows no eval: tell zod not to probe for it (the probe is reported as a violation).
z.config({ jitless: true });

createApp(App).use(createPinia()).use(router).use(i18n).use(VueQueryPlugin, { queryClient }).mount('#app');
