"""Page model: a material's Markdown notes as safe HTML.

Raw HTML and entities in the source are shown as text, never as markup; links to anything but
http, https and mailto, and images, are shown as their text (notes load nothing).
"""

from __future__ import annotations

import markdown
import markdown.extensions
import markdown.treeprocessors

SAFE_URL_SCHEMES = ("http", "https", "mailto")



def url_is_safe(url: str) -> bool:
    """True for a relative URL or an http(s)/mailto one; javascript:, data: and the like are not."""
    compact = "".join(ch for ch in url if ch > " ").lower()
    head = compact.split("/", 1)[0].split("?", 1)[0].split("#", 1)[0]
    if ":" not in head:
        return True
    return head.split(":", 1)[0] in SAFE_URL_SCHEMES


class InertLinks(markdown.treeprocessors.Treeprocessor):
    """After Markdown's own inline pass: a link to an unsafe URL becomes its text, an image its alt text
    (notes load nothing, and nothing from another origin)."""

    def run(self, root):
        for element in root.iter():
            if element.tag == "img":
                alt = element.get("alt", "")
                element.attrib.clear()
                element.tag = "span"
                element.text = alt
            elif element.tag == "a" and not url_is_safe(element.get("href", "")):
                element.attrib.clear()
                element.tag = "span"


class InertLinksExtension(markdown.extensions.Extension):
    """Raw HTML and entities stay text: Markdown's passes that keep them as markup are removed, so
    the serializer escapes ``<`` and ``&`` once, in text and code alike (escaping the source first
    escaped them twice inside code spans and blocks); unsafe links and images become text."""

    def extendMarkdown(self, md):  # noqa: N802 - the Markdown API's name
        md.preprocessors.deregister("html_block")
        md.inlinePatterns.deregister("html")
        md.inlinePatterns.deregister("entity")
        md.treeprocessors.register(InertLinks(md), "inert_links", 0)


def markdown_safe(text: str) -> str:
    """Markdown to HTML with any raw HTML or entity in the source shown as text, never as markup;
    links to javascript: (or any scheme but http, https, mailto) and images are shown as their text."""
    return markdown.markdown(text, output_format="html", extensions=[InertLinksExtension()])
