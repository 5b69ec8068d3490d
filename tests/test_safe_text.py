"""Text from people and files shown safely: no control character reaches a terminal raw."""

from hypothesis import given
from hypothesis import strategies as st

from survey.safe_text import count_cut, shorten, visible


def _no_raw_controls(text: str, allow: str = "\t") -> bool:
    import unicodedata

    return all(
        c in allow or unicodedata.category(c) not in {"Cc", "Cf", "Cs", "Zl", "Zp"} for c in text
    )


def test_escape_sequence_is_made_visible():
    """An ESC colour sequence and BEL are written as escapes, the rest kept."""
    assert visible("a\x1b[31mb\x07") == "a\\x1b[31mb\\x07"


def test_bidi_override_is_made_visible():
    """A right-to-left override (U+202E) cannot reorder what the reader sees."""
    assert visible("abc\u202edef") == "abc\\u202edef"


def test_newline_kept_only_when_asked():
    """A one-line message stays one line; a note keeps its lines."""
    assert visible("a\nb") == "a\\nb"
    assert visible("a\nb", keep_newlines=True) == "a\nb"


def test_shorten_bounds_length():
    """A 1 MB value quoted in a message is cut to the limit with an ellipsis."""
    out = shorten("k" * 1_000_000, 80)
    assert len(out) == 80 and out.endswith("…")


def test_count_cut_names_the_rest():
    """A long list of ids is cut with a count."""
    assert count_cut([f"r{i}" for i in range(20)], 3) == "r0, r1, r2 and 17 more"


@given(st.text())
def test_visible_never_leaves_a_raw_control(text):
    """Whatever the input, the output holds no control, format or separator character."""
    assert _no_raw_controls(visible(text))
    assert _no_raw_controls(visible(text, keep_newlines=True), allow="\t\n")
