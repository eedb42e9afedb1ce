// An error body in the reader's language: the error's own key when it has one (with its figures),
// else the text for its code. Field errors of a translated error keep their keys; their texts stay
// in English only when no translation exists (the message above them is then translated).
import { isLanguage, hasKey, translate } from '../../shared/i18n';

type Body = { code: string; message: string; fieldErrors?: Record<string, string[]> } & Record<string, unknown>;

export function localizeError(body: Body, language: string, i18n: unknown): Body {
  if (!isLanguage(language) || language === 'en') return body;
  const own = i18n as { key?: string; params?: Record<string, string | number> } | undefined;
  if (own?.key && hasKey(language, own.key)) return { ...body, message: translate(language, own.key, own.params) };
  const byCode = `errors.${body.code}`;
  if (hasKey(language, byCode)) return { ...body, message: translate(language, byCode) };
  return body;
}
