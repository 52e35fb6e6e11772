import { describe, expect, it } from "vitest";
import { escapeHtml, mailHtml, mailText } from "~/lib/mail/layout";
import { buildSheetMail, INVITE_DAYS, inviteMail, RESET_MINUTES, resetMail } from "~/lib/mail/messages";

describe("the mail layout", () => {
  it("escapes everything a shop or person typed", () => {
    expect(escapeHtml(`<b>"Tom's" & co</b>`)).toBe("&lt;b&gt;&quot;Tom&#39;s&quot; &amp; co&lt;/b&gt;");
    const html = mailHtml(
      "Hi <script>",
      [{ p: "<img src=x onerror=alert(1)>" }, { button: { href: 'https://x.example/a"b', label: "Go" } }],
      "footer",
    );
    expect(html).not.toContain("<script>");
    expect(html).not.toContain("<img");
    expect(html).toContain('href="https://x.example/a&quot;b"');
  });

  it("gives a plain-text part with the same words and the link written out", () => {
    const text = mailText(
      "Title",
      [{ p: "One." }, { rows: [["Gasket", "MLS"]] }, { button: { href: "https://x.example/l", label: "Open" } }],
      "Why you got this.",
    );
    expect(text).toBe("Title\n=====\n\nOne.\n\nGasket: MLS\n\nOpen:\nhttps://x.example/l\n\n-- \nWhy you got this.\n");
  });
});

describe("the messages", () => {
  const link = "http://localhost:3000/invite/abc";
  it("the invite names the shop, the role, the one-time link and how long it lasts", () => {
    const m = inviteMail({ teamName: "Demo & Sons", inviterName: "Ann", role: "viewer", link });
    expect(m.subject).toBe("Ann invites you to Demo & Sons on Sealwright");
    expect(m.text).toContain(link);
    expect(m.text).toContain(`works once and for ${INVITE_DAYS} days`);
    expect(m.html).toContain("Demo &amp; Sons");
    // no tracking: nothing the mail would fetch
    for (const part of [m.html]) expect(part).not.toMatch(/<img|src=|url\(|@import/i);
  });

  it("the reset says it works once for an hour and that other devices are signed out", () => {
    const m = resetMail({ name: "Ann", link: "http://localhost:3000/reset-password/t" });
    expect(RESET_MINUTES).toBe(60);
    expect(m.text).toContain("works once and for 60 minutes");
    expect(m.text).toContain("signed out");
  });

  it("the build sheet mail carries the summary rows, the note and the caution", () => {
    const m = buildSheetMail({
      teamName: "Shop",
      senderName: "Bo",
      recipientName: "Cy",
      engineName: "Four",
      planName: "Copper",
      verdict: "Holds: fine",
      rows: [["Weakest seal margin", "1.80"]],
      link,
      note: "",
    });
    expect(m.text).toContain("Weakest seal margin: 1.80");
    expect(m.text).toContain("Our estimate: Holds: fine");
    expect(m.text).toContain("makers' torque, lubricant and procedure govern");
    expect(m.text).not.toContain("\n\n\n");
  });
});
