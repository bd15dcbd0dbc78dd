import { expect, test as setup } from "./fixtures";
import { DEMO, DEMO_PASSWORD, storageState, type DemoRole } from "./roles";

// One signed-in browser state per demo role, reused by the journeys.
for (const role of Object.keys(DEMO) as DemoRole[]) {
  setup(`sign in as the demo ${role}`, async ({ page }) => {
    await page.goto("/sign-in");
    await page.getByLabel("E-mail", { exact: true }).fill(DEMO[role].email);
    await page.getByLabel("Password", { exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    const nav = page.getByRole("navigation", { name: "Main" }).first();
    await expect(nav.getByRole("button", { name: "Sign out" })).toBeVisible();
    await page.context().storageState({ path: storageState(role) });
  });
}
