// The languages of Toolgate and a plain translate() for the server (mail, error messages). The app
// feeds the same resources to i18next (src/lib/i18n.ts).
import { en, type Messages } from './en';
import { zhHans } from './zh-Hans';

export const languages = ['en', 'zh-Hans'] as const;
export type Language = (typeof languages)[number];

export const resources: Record<Language, Messages> = { en, 'zh-Hans': zhHans };

export const isLanguage = (v: unknown): v is Language => typeof v === 'string' && (languages as readonly string[]).includes(v);

/** "zh-CN", "zh-Hans-CN", "zh_SG" -> zh-Hans; anything else -> en (the first default from the device). */
export function languageFromLocale(tag: string | null | undefined): Language {
  const t = (tag ?? '').toLowerCase().replace('_', '-');
  if (t === 'zh' || t.startsWith('zh-hans') || t === 'zh-cn' || t === 'zh-sg') return 'zh-Hans';
  return 'en';
}

type Join<K, P> = K extends string ? (P extends string ? `${K}.${P}` : never) : never;
type Paths<T> = { [K in keyof T]: T[K] extends string ? K : Join<K, Paths<T[K]>> }[keyof T];
/** Every key, "cut.title", "errors.receipt_missing", ... */
export type MessageKey = Paths<Messages>;

function lookup(tree: unknown, key: string): string | undefined {
  let node: unknown = tree;
  for (const part of key.split('.')) {
    if (!node || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[part];
  }
  return typeof node === 'string' ? node : undefined;
}

export const hasKey = (language: Language, key: string) => lookup(resources[language], key) !== undefined;

/** The text of `key` in `language` (English when missing), with {{name}} placeholders filled. */
export function translate(language: Language, key: MessageKey | (string & {}), params: Record<string, string | number> = {}): string {
  const text = lookup(resources[language], key) ?? lookup(resources.en, key) ?? key;
  return text.replace(/\{\{(\w+)\}\}/g, (m, name: string) => (name in params ? String(params[name]) : m));
}

/** Every key of a resource tree, sorted ("a.b", "a.c"). */
export function keysOf(tree: object, prefix = ''): string[] {
  return Object.entries(tree)
    .flatMap(([k, v]) => (typeof v === 'string' ? [`${prefix}${k}`] : keysOf(v as object, `${prefix}${k}.`)))
    .sort();
}
