"""The report as blocks, and those blocks as GitHub-flavoured Markdown.

The report is built as a list of typed blocks (:class:`Heading`, :class:`Para`,
:class:`Items`, :class:`Table`, :class:`Photo`) holding plain strings; this module writes
them out. Every string a block holds is plain text — a sentence from :mod:`survey.words` or
text from the survey file (a room name, a label, a note) — and is passed through
:func:`escape`, the one escaping helper, when it is written. The Markdown structure
(heading marks, table pipes, list marks, image syntax) is added only here, around escaped
text, so nothing a person typed can become a heading, a table cell, a link, an image or
raw HTML.

What :func:`escape` does:

* control, format and separator characters become visible escapes
  (:func:`survey.safe_text.visible`), a newline included (``\\n``);
* every character CommonMark and GitHub read as inline markup is backslash-escaped: ``\\``,
  backticks, ``*``, ``_``, ``[``, ``]``, ``<``, ``>``, ``|`` (a table cell), ``&`` (an entity
  such as ``&lt;``), ``~`` (strike-through) and ``$`` (GitHub's maths);
* a mark that only means something at the start of a line is escaped there: ``#``
  (heading), ``-``, ``+`` or ``=`` followed by a space or a run of them (a list, a rule or a
  heading underline), ``1.``/``1)`` followed by a space (a numbered list); so ``-3.2 °C``
  stays as it is.

``(``, ``)`` and ``!`` are left as they are: they form a link or an image only together
with ``[`` and ``]``, which are always escaped, and escaping them would put a backslash
before every bracket of every sentence for a reader in a terminal pager.
A note of several lines (:func:`escape_lines`) keeps its line breaks as Markdown hard
breaks, each line escaped on its own.
"""

from __future__ import annotations

import re
from collections.abc import Iterable
from dataclasses import dataclass, field
from functools import lru_cache

from survey.safe_text import visible

#: Characters escaped wherever they are.
_INLINE = re.compile(r"([\\`*_\[\]<>|&~$])")
#: What marks a block at the start of a line: heading, list, setext underline, numbered list.
_LEADING = re.compile(r"^(#|[-+=](?=[\s+=-]|$)|\d{1,9}[.)](?=\s|$))")


@lru_cache(maxsize=4096)
def _escape_str(text: str) -> str:
    shown = visible(text).strip()
    shown = _INLINE.sub(r"\\\1", shown)
    match = _LEADING.match(shown)
    if match:
        mark = match.group(1)
        shown = (mark[:-1] + "\\" + mark[-1]) + shown[len(mark) :]
    return shown


def escape(text: object) -> str:
    """``text`` as Markdown inline text that shows exactly as written (one line)."""
    return _escape_str(text if text.__class__ is str else str(text))


def escape_lines(text: object) -> list[str]:
    """A multi-line note as paragraphs of escaped lines (blank lines separate paragraphs).

    Returns Markdown lines: a line inside a paragraph ends with a backslash (a hard break),
    paragraphs are separated by an empty line."""
    paragraphs: list[list[str]] = [[]]
    raw = str(text).replace("\r\n", "\n")
    for line in visible(raw, keep_newlines=True).split("\n"):
        if not line.strip():
            if paragraphs[-1]:
                paragraphs.append([])
            continue
        paragraphs[-1].append(escape(line))
    out: list[str] = []
    for lines in paragraphs:
        if not lines:
            continue
        if out:
            out.append("")
        out.extend(f"{line}\\" for line in lines[:-1])
        out.append(lines[-1])
    return out


# --- blocks ----------------------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class Cell:
    """A table cell: the text shown, and (for a number) the SI value it shows and the name
    of the quantity in the assessment it came from (so tests read typed values)."""

    text: str
    value: float | None = None
    key: str = ""


@dataclass(frozen=True, slots=True)
class Heading:
    level: int
    text: str


@dataclass(frozen=True, slots=True)
class Para:
    """A paragraph; ``strong`` sets a short lead-in in bold before it."""

    text: str
    strong: str = ""
    note: bool = False  #: a person's multi-line note: its line breaks are kept
    name: str = ""
    room: str = ""
    visit: int | None = None
    values: tuple[object, ...] = ()  #: the typed records the paragraph says


@dataclass(frozen=True, slots=True)
class Items:
    """A bulleted (or numbered) list of paragraphs; an item may have a bold lead-in."""

    items: tuple[tuple[str, str], ...]  #: (lead-in, text); lead-in may be ""
    numbered: bool = False
    name: str = ""
    room: str = ""
    visit: int | None = None
    values: tuple[object, ...] = ()  #: the typed records the items say (e.g. the actions)


@dataclass(frozen=True, slots=True)
class Table:
    """A table; ``name`` and ``room`` tell tests which table of which room it is."""

    header: tuple[str, ...]
    rows: tuple[tuple[Cell, ...], ...]
    right: frozenset[int] = frozenset()  #: columns aligned right (numbers)
    name: str = ""
    room: str = ""
    visit: int | None = None

    def __post_init__(self) -> None:
        for row in self.rows:
            if len(row) != len(self.header):
                raise ValueError(
                    f"table {self.name!r}: a row of {len(row)} cells under a "
                    f"header of {len(self.header)}"
                )


@dataclass(frozen=True, slots=True)
class Photo:
    """A photo: its caption and its link (relative, already percent-encoded)."""

    caption: str
    link: str


Block = Heading | Para | Items | Table | Photo


@dataclass(slots=True)
class Document:
    """The report as blocks, in order, with the title for an HTML page."""

    title: str
    blocks: list[Block] = field(default_factory=list)

    def add(self, *blocks: Block) -> None:
        self.blocks.extend(blocks)


# --- Markdown --------------------------------------------------------------------------------


def _strong(lead: str) -> str:
    return f"**{escape(lead)}**" if lead else ""


def _join(lead: str, text: str) -> str:
    lead_md = _strong(lead)
    text_md = escape(text) if text else ""
    return f"{lead_md} {text_md}".strip()


def _table(table: Table) -> list[str]:
    def line(cells: Iterable[str]) -> str:
        return "| " + " | ".join(cells) + " |"

    head = [escape(h) or " " for h in table.header]
    rule = [("---:" if i in table.right else "---") for i in range(len(table.header))]
    out = [line(head), line(rule)]
    out += [line(escape(c.text) or "–" for c in row) for row in table.rows]
    return out


def _para(block: Para) -> list[str]:
    if not block.note:
        return [_join(block.strong, block.text)]
    lines = escape_lines(block.text) or [""]
    if block.strong:
        lines[0] = f"{_strong(block.strong)} {lines[0]}".strip()
    return lines


def _items(block: Items) -> list[str]:
    out = []
    for number, (lead, text) in enumerate(block.items, start=1):
        mark = f"{number}." if block.numbered else "-"
        out.append(f"{mark} {_join(lead, text)}")
    return out


def render(doc: Document) -> str:
    """The document as GitHub-flavoured Markdown (LF line ends, one final newline)."""
    parts: list[str] = []
    for block in doc.blocks:
        if isinstance(block, Heading):
            lines = ["#" * block.level + " " + escape(block.text)]
        elif isinstance(block, Para):
            lines = _para(block)
        elif isinstance(block, Items):
            lines = _items(block)
        elif isinstance(block, Table):
            lines = _table(block)
        else:
            lines = [f"![{escape(block.caption)}]({block.link})", "", f"*{escape(block.caption)}*"]
        parts.append("\n".join(lines))
    return "\n\n".join(parts) + "\n"
