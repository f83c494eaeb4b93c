/** What each electronic signature means, shown to the signer before the password. */
export const MEANINGS = {
  authored:
    'By signing you confirm that you performed this study and that its data and conclusion are complete and correct as entered. You submit it for review by a second person.',
  reviewed: 'By signing you confirm you reviewed this study and approve its results.',
  released: 'By signing you confirm, as quality manager, that the study was reviewed and you release it: it then counts as approved.',
};
