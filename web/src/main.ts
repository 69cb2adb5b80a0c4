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
import { detectFlexGapSupported } from 'ant-design-vue/es/_util/styleChecker';
import { defaultConfig, globalDesignTokenApi } from 'ant-design-vue/es/theme/internal';
import { designTokenValue } from './theme';

// antd's grid asks once whether the browser supports flex gap by laying out a probe in the
// body and reading its height: a forced layout of the whole page. Asked by the first form item
// on the design workspace, that layout held the main thread for 40 ms and more at 4x CPU
// throttling; asked here, before anything is mounted, it lays out an empty body. The answer is
// kept by antd for the life of the page.
detectFlexGapSupported();
// The theme's tokens as the page's global theme before the first component asks (theme.ts).
globalDesignTokenApi.value = designTokenValue(defaultConfig);

const app = createApp(App);
const pinia = createPinia();
app.use(pinia);
const router = createAppRouter();
installUnauthorizedHandler(router);
app.use(router);
// Mounting (antd works out its theme's tokens, the router resolves the first page) is a task of
// its own, after the one that evaluated the modules: together they were the longest task of
// opening a page on a slow machine.
setTimeout(() => {
  app.mount('#app');
  installA11yMending();
}, 0);
