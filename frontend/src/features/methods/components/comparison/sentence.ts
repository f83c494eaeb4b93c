/** An engine reason ("each mean needs …") as a sentence on screen. */
export const sentence = (text: string) => `${text.charAt(0).toUpperCase()}${text.slice(1)}${/[.!?]$/.test(text) ? '' : '.'}`;
