/** Said with every run on screen, exported and printed: the software computes, the laboratory decides. */
export const RUN_CAUTION =
  'Results are reported under the laboratory’s own procedures and the regulations that apply to the sample (for drinking water and released products, the limits and reporting rules of the competent authority). A qualified person reviews them before release. The results of a rejected run are not reportable.';
