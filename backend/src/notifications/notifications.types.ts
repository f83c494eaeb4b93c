export interface NotificationDto {
  id: string;
  kind: string;
  message: string;
  link: string | null;
  readAt: string | null;
  createdAt: string;
}

export interface NotificationListDto {
  items: NotificationDto[];
  unread: number;
}

export interface Notice {
  kind: string;
  message: string;
  link: string | null;
}
