// The mail look (app/lib/mail/layout.ts): escaped text, no remote content, the same words in both parts.
import { describe, expect, it } from "vitest";
import { escapeHtml, mail, mailHtml, mailText } from "../../../../app/lib/mail/layout";

const blocks = [
  { p: "Your plan <A & B> is ready." },
  { button: { href: "https://shop.example/r?t=1&u=2", label: "Open it" } },
  { rows: [["Engine", 'I4 "test"']] as [string, string][] },
  { small: "Ignore this if it was not you." },
];

describe("escapeHtml", () => {
  it("escapes the five characters that matter in HTML text and attributes", () => {
    expect(escapeHtml(`<a href="x" title='y'>&</a>`)).toBe("&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;&lt;/a&gt;");
    expect(escapeHtml("plain")).toBe("plain");
  });
});

describe("mailHtml", () => {
  const html = mailHtml("Title <1>", blocks, "You asked for it.");
  it("escapes every piece of text, the link included", () => {
    expect(html).toContain("Your plan &lt;A &amp; B&gt; is ready.");
    expect(html).toContain('href="https://shop.example/r?t=1&amp;u=2"');
    expect(html).toContain("<title>Title &lt;1&gt;</title>");
    expect(html).toContain("I4 &quot;test&quot;");
    expect(html).not.toContain("<A & B>");
  });
  it("loads nothing from elsewhere: no images, no scripts, no style sheets; the link is also written out", () => {
    expect(html).not.toMatch(/<img|<script|<link|url\(/i);
    expect(html.match(/https:\/\/shop\.example\/r\?t=1&amp;u=2/g)).toHaveLength(2);
  });
});

describe("mailText and mail", () => {
  it("the plain part: title underlined, blocks in order, the link on its own line, the footer after a sig dash", () => {
    expect(mailText("Hello", blocks, "Footer")).toBe(
      'Hello\n=====\n\nYour plan <A & B> is ready.\n\nOpen it:\nhttps://shop.example/r?t=1&u=2\n\nEngine: I4 "test"\n\nIgnore this if it was not you.\n\n-- \nFooter\n',
    );
  });
  it("mail() carries the subject and both parts", () => {
    const m = mail("Subject", "Hello", blocks, "Footer");
    expect(m.subject).toBe("Subject");
    expect(m.text).toBe(mailText("Hello", blocks, "Footer"));
    expect(m.html).toBe(mailHtml("Hello", blocks, "Footer"));
  });
});
