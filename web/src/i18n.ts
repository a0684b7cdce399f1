import { createI18n } from 'vue-i18n';
import en from './locales/en.json';

export type MessageSchema = typeof en;

declare module 'vue-i18n' {
  // Typed message keys for `t()` everywhere.
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  export interface DefineLocaleMessage extends MessageSchema {}
}

export const i18n = createI18n<[MessageSchema], 'en', false>({
  legacy: false,
  locale: 'en',
  fallbackLocale: 'en',
  messages: { en },
});
