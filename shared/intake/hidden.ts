/**
 * Characters that show nothing but change what is stored: zero-width spaces and non-joiners, word
 * joiners and invisible operators, the byte-order mark, the Mongolian vowel separator and the soft
 * hyphen (Unicode's Default_Ignorable_Code_Point property lists them). Spam hides words behind them
 * to slip past grouping, so a public suggestion may hold none. The zero-width joiner is allowed
 * only between two emoji, where it builds one picture (Unicode Technical Standard #51, "ZWJ sequences").
 */
const HIDDEN = /[\u00AD\u180E\u200B\u200C\u200E\u200F\u2060-\u2064\uFEFF]/u;
const LONE_JOINER = /(?<!\p{Extended_Pictographic}\uFE0F?)\u200D|\u200D(?!\p{Extended_Pictographic})/u;

export const hasHiddenCharacter = (text: string) => HIDDEN.test(text) || LONE_JOINER.test(text);

export const hiddenCharacterMessage = "Remove the invisible characters (zero-width spaces and the like) from the text.";
