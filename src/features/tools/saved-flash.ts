// A one-shot "saved" note handed from the edit screen to the detail screen it returns to
// (the detail stays mounted under the edit screen, so a route param would not reach it).
const saved = new Set<string>();

export const markToolSaved = (id: string): void => {
  saved.add(id);
};

/** True once after markToolSaved(id). */
export const takeToolSaved = (id: string): boolean => saved.delete(id);
