import { createApp } from 'vue';
import { createPinia } from 'pinia';
import '@fontsource/lato/400.css';
import '@fontsource/lato/700.css';
import '@fontsource/lato/900.css';
import 'ant-design-vue/dist/reset.css';
import './styles/base.css';
import App from './App.vue';
import { createAppRouter, installUnauthorizedHandler } from './router';
import { installA11yMending } from './a11y';

const app = createApp(App);
const pinia = createPinia();
app.use(pinia);
const router = createAppRouter();
installUnauthorizedHandler(router);
app.use(router);
app.mount('#app');
installA11yMending();
