import { z } from "zod";

export const saveViewSchema = z.object({
  name: z.string().trim().min(1, "Name the view").max(100),
  path: z.string().regex(/^\/lots\/[^?#]+$/, "Only lot pages can be saved as views"),
  query: z.string().max(2000).regex(/^[^#]*$/),
});
export const viewIdSchema = z.object({ viewId: z.string().uuid() });

export interface SavedView {
  id: string;
  name: string;
  href: string;
  createdAt: string;
}
