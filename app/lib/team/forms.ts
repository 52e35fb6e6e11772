// The team page's and the token page's forms: what a shop's name, an invite, a role and a token may be.
// Parsed through Conform, which reads a blank field as missing: each field's own message covers that too.
import { z } from "zod";
import { ROLES } from "./roles";

const Role = z.enum(ROLES, "Pick owner, builder or viewer");
const Id = z.coerce.number({ error: "No such member" }).int("No such member").positive("No such member");

export const TeamNameSchema = z.object({
  name: z.string({ error: "Name the shop" }).trim().min(1, "Name the shop").max(120, "Keep the shop name under 120 characters"),
});
export const InviteSchema = z.object({ email: z.email("Enter an e-mail address like name@shop.example").max(254), role: Role });
export const RoleSchema = z.object({ userId: Id, role: Role });
export const MemberSchema = z.object({ userId: Id });
export const RevokeInviteSchema = z.object({ inviteId: Id });

const TOKEN_NAME = "Name the token (what will use it: “dyno laptop”)";
export const TokenCreateSchema = z.object({
  name: z.string({ error: TOKEN_NAME }).trim().min(1, TOKEN_NAME).max(80, "At most 80 characters"),
  role: z.enum(ROLES, "Pick what the token may do"),
});
