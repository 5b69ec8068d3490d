"""The report as one self-contained HTML page, rendered from its Markdown.

markdown-it-py (CommonMark with GitHub's tables) renders the same Markdown the ``.md``
report holds, with raw HTML switched off (``html=False``), so any ``<tag>`` that reached the
Markdown is shown as text, never passed through. The page carries its print stylesheet
inline: no scripts, no fonts or styles fetched from anywhere; photos are linked by relative
path, charts carried inline as ``data:`` URIs. A browser prints it to PDF.
"""

from __future__ import annotations

import base64
import html
from collections.abc import Mapping
from typing import Any

#: Print-friendly styles: A4 margins, tables that break between rows, headings kept with
#: what follows them, and links printed as plain text.
_CSS = """
@page { size: A4; margin: 18mm 16mm; }
body { font-family: Georgia, "Times New Roman", serif; font-size: 11pt; line-height: 1.45;
       color: #111; max-width: 48em; margin: 2em auto; padding: 0 1em; }
h1 { font-size: 1.7em; margin-bottom: 0.2em; }
h2 { font-size: 1.35em; border-bottom: 1px solid #888; padding-bottom: 0.15em;
     margin-top: 1.6em; }
h3 { font-size: 1.15em; margin-top: 1.3em; }
h4 { font-size: 1em; margin-top: 1em; }
h1, h2, h3, h4 { font-family: "Helvetica Neue", Arial, sans-serif; break-after: avoid;
                 page-break-after: avoid; }
table { border-collapse: collapse; width: 100%; margin: 0.6em 0; font-size: 0.9em; }
th, td { border: 1px solid #999; padding: 0.25em 0.45em; vertical-align: top;
         text-align: left; }
th { background: #eee; }
tr { break-inside: avoid; page-break-inside: avoid; }
img { max-width: 100%; max-height: 12cm; }
li { margin: 0.2em 0; }
@media print { body { margin: 0; max-width: none; } a { color: inherit;
               text-decoration: none; } }
""".strip()


def parser() -> Any:
    """The one Markdown parser of the report: CommonMark + tables, raw HTML off."""
    from markdown_it import MarkdownIt

    return MarkdownIt("commonmark", {"html": False, "linkify": False, "typographer": False}).enable(
        "table"
    )


def _embed_images(md: Any, tokens: list[Any], images: Mapping[str, str]) -> None:
    """Point every image whose link is a key of ``images`` (an SVG beside the report) at a
    ``data:`` URI of that SVG, so the page needs no file beside it. An ``<img>`` never runs
    what an SVG holds, and ours holds no script anyway."""
    wanted = {md.normalizeLink(link): svg for link, svg in images.items()}
    for token in tokens:
        for child in token.children or ():
            if child.type == "image" and child.attrGet("src") in wanted:
                data = base64.b64encode(wanted[child.attrGet("src")].encode("utf-8"))
                child.attrSet("src", "data:image/svg+xml;base64," + data.decode("ascii"))


def to_html(markdown_text: str, title: str, images: Mapping[str, str] | None = None) -> str:
    """A whole HTML document of the Markdown report, titled ``title``; ``images`` maps the
    links of charts in the Markdown to their SVG text, which the page then carries inline."""
    md = parser()
    tokens = md.parse(markdown_text)
    if images:
        _embed_images(md, tokens, images)
    body = md.renderer.render(tokens, md.options, {})
    return (
        '<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n'
        '<meta name="viewport" content="width=device-width, initial-scale=1">\n'
        f"<title>{html.escape(title)}</title>\n<style>\n{_CSS}\n</style>\n</head>\n"
        f"<body>\n{body}</body>\n</html>\n"
    )
