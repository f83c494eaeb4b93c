export interface Notice {
  kind: string;
  message: string;
  link: string | null;
}
