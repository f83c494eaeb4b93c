/** Response bodies of /api/notifications: in-app notices addressed to the signed-in user. */

export interface NotificationDto {
  id: string;
  kind: string;
  message: string;
  /** The screen the notice is about, as a path of the app. */
  link: string | null;
  readAt: string | null;
  createdAt: string;
}

export interface NotificationListDto {
  items: NotificationDto[];
  unread: number;
}
