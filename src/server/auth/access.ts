import { createAccessControl } from "better-auth/plugins/access";
import { roleGrants, statement } from "@/contracts/roles";

export const ac = createAccessControl(statement);

export const roles = {
  owner: ac.newRole(roleGrants.owner),
  admin: ac.newRole(roleGrants.admin),
  editor: ac.newRole(roleGrants.editor),
  viewer: ac.newRole(roleGrants.viewer),
};
