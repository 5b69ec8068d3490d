"""Text from a person or a file, made safe to show: the one helper every face uses.

Room names, labels, notes, site fields, file names, unknown keys and values quoted in error
messages come from people and from files that arrive by e-mail or a shared folder. Shown on a
terminal they must never drive it: an ESC sequence could move the cursor, retitle the window or
write a hyperlink; BEL rings; a bidi override reorders what the reader sees. :func:`visible`
replaces every such character with a visible escape (``\\x1b``, ``\\u202e``) and keeps newline
and tab only where asked. :func:`shorten` bounds a value quoted in a message. :func:`fold`
gives text as compared when two readings name the same point.

Markup is a separate matter: the faces pass these strings to Rich and Textual as plain ``Text``
(never as markup), and the report escapes them for Markdown.
"""

from __future__ import annotations

import unicodedata

#: A value quoted in a one-line message is cut to this many characters (with an ellipsis).
QUOTE_MAX_CHARS = 80

#: Categories that never reach a terminal raw: control (Cc), format (Cf: bidi overrides,
#: zero-width joiners), surrogates (Cs), private use is harmless and kept; line and paragraph
#: separators (Zl, Zp) break a one-line message.
_UNSAFE_CATEGORIES = frozenset({"Cc", "Cf", "Cs", "Zl", "Zp"})


def _escape(char: str) -> str:
    code = ord(char)
    if code < 0x100:
        return f"\\x{code:02x}"
    if code < 0x10000:
        return f"\\u{code:04x}"
    return f"\\U{code:08x}"


def visible(text: object, *, keep_newlines: bool = False) -> str:
    """``text`` with every control, format and separator character written as an escape.

    Tab is kept; newline is kept when ``keep_newlines`` (a multi-line note), otherwise written
    as ``\\n`` so a one-line message stays one line.
    """
    text = str(text)
    if text.isprintable() and "\t" not in text:
        return text  # the common case, fast
    out = []
    for char in text:
        if char == "\t" or (char == "\n" and keep_newlines):
            out.append(char)
        elif char == "\n":
            out.append("\\n")
        elif unicodedata.category(char) in _UNSAFE_CATEGORIES:
            out.append(_escape(char))
        else:
            out.append(char)
    return "".join(out)


def shorten(text: object, limit: int = QUOTE_MAX_CHARS) -> str:
    """``text`` made :func:`visible` and cut to ``limit`` characters with an ellipsis."""
    shown = visible(text)
    if len(shown) <= limit:
        return shown
    return shown[: max(limit - 1, 1)] + "…"


def count_cut(items: list[str], limit: int = 8) -> str:
    """A list of names for a message: at most ``limit``, each shortened, then "and N more"."""
    shown = [shorten(item, 40) for item in items[:limit]]
    rest = len(items) - len(shown)
    text = ", ".join(shown)
    return f"{text} and {rest} more" if rest > 0 else text


def fold(text: str) -> str:
    """Text as compared for matching points: the Unicode compatibility caseless form
    NFKD(casefold(NFKD(casefold(NFD(text))))) (The Unicode Standard ch. 3, D146; the
    definition number from memory), with every run of white space made one space and the
    ends trimmed."""
    nfd = unicodedata.normalize("NFD", text).casefold()
    folded = unicodedata.normalize("NFKD", unicodedata.normalize("NFKD", nfd).casefold())
    return " ".join(folded.split())
