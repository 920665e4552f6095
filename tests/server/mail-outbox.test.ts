// The outbox sends through the real local mail catcher: both parts arrive, names holding markup are text in
// the HTML part, and links are on the configured public origin.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/server/db/client";
import { mailOutbox } from "@/server/db/schema";
import { commentNoticeMail, invitationMail, publicUrl, queueMail, sendMail } from "@/server/mail";
import { uniqueEmail } from "../helpers/api";
import { waitForMail } from "../helpers/mail";

const MARKUP = `<script>alert("x")</script><b>Bold</b> & Co`;

describe("mail outbox", () => {
  it("sends a plain-text and an HTML part, with markup in names shown as text", async () => {
    const to = uniqueEmail("outbox");
    const url = publicUrl("/invitations/abc");
    const sent = await sendMail({ to, ...invitationMail({ workspaceName: MARKUP, inviterName: "Iva <i>Nolan</i>", role: "editor", url, expiresAt: new Date(Date.UTC(2030, 0, 2)) }) });
    expect(sent.state).toBe("sent");
    const mail = await waitForMail(to, /invited you/);
    expect(mail.to).toEqual([to]);
    expect(mail.subject).toBe(`Iva <i>Nolan</i> invited you to ${MARKUP} on Knucklebench`);
    expect(mail.text).toContain(`“${MARKUP}”`);
    expect(mail.text).toContain(`${process.env.BETTER_AUTH_URL}/invitations/abc`);
    expect(mail.html).not.toContain("<script>");
    expect(mail.html).not.toContain("<b>Bold</b>");
    expect(mail.html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;&lt;b&gt;Bold&lt;/b&gt; &amp; Co");
    expect(mail.html).toContain(`href="${process.env.BETTER_AUTH_URL}/invitations/abc"`);
    const [row] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, sent.id));
    expect(row).toMatchObject({ status: "sent", attempts: 1, lastError: null });
  });

  it("queues a comment notice whose body and kit name stay text", async () => {
    const to = uniqueEmail("notice");
    await queueMail({ to, ...commentNoticeMail({ kitName: "<img src=x onerror=alert(1)>", authorName: "Odile", body: "Caster <b>too</b> high?\nCheck it", url: publicUrl("/workspaces/w/kits/k") }) });
    const mail = await waitForMail(to, /commented on/);
    expect(mail.subject).toBe("Odile commented on <img src=x onerror=alert(1)>");
    expect(mail.html).not.toMatch(/<img/);
    expect(mail.html).toContain("&lt;img src=x onerror=alert(1)&gt;");
    expect(mail.html).toContain("Caster &lt;b&gt;too&lt;/b&gt; high?");
    expect(mail.text).toContain("> Caster <b>too</b> high?\n> Check it");
  });
});
