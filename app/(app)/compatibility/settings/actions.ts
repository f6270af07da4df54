"use server";

import { formToObject, runAction } from "@/lib/server/action";
import { ForbiddenError } from "@/lib/server/errors";
import { saveSiteSettings } from "@/lib/server/queries/compatibility";
import { userSiteIds } from "@/lib/server/queries/users";
import type { ActionState } from "@/lib/validation/action-state";
import { settingsSchema } from "@/lib/validation/compatibility";

export async function saveSettingsAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    { action: "compatibility.rules.manage", schema: settingsSchema, revalidate: ["/compatibility", "/compatibility/settings"], success: "Settings saved." },
    formToObject(form, ["enabledCharts"]),
    async (data, user) => {
      if (!(await userSiteIds(user.id)).includes(data.siteId)) throw new ForbiddenError("You have no access to this site.");
      await saveSiteSettings(data, user.id);
    },
  );
}
