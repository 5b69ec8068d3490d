"""Text from people is text: whatever a label holds, ``survey check`` neither crashes nor
sends a control character to the terminal, and markup is shown literally."""

from __future__ import annotations

import json
import unicodedata

from hypothesis import given, settings
from hypothesis import strategies as st

_UNSAFE = {"Cc", "Cf", "Cs", "Zl", "Zp"}


def _clean(text: str) -> bool:
    return all(c in "\n\t" or unicodedata.category(c) not in _UNSAFE for c in text)


def test_markup_in_a_label_is_shown_literally(check, monkeypatch):
    """A label of `[/bold]` or `[link=…]` is printed as typed, never parsed as Rich markup
    (it raised MarkupError, or became a terminal hyperlink)."""
    monkeypatch.setenv("COLUMNS", "200")
    for label in ("[/bold]", "[link=http://x.invalid]click[/link]", "[b]Loft[/b]"):
        status, out, err = check(
            "--air-temp", "18", "--rh", "72", "--surface", f"external_wall:12:{label}"
        )
        assert status == 0, err
        assert label in out


def test_escape_sequences_in_a_label_are_made_visible(check):
    """An ESC colour sequence or BEL in a label reaches the output as a visible escape."""
    status, out, _ = check(
        "--air-temp", "18", "--rh", "72", "--surface", "external_wall:12:a\x1b[31mred\x07"
    )
    assert status == 0
    assert "\x1b" not in out and "\x07" not in out
    assert "\\x1b[31mred\\x07" in out


def _run(*args: str) -> tuple[int, str, str]:
    """``survey check ARGS`` in-process, its output captured (a hypothesis-safe runner)."""
    import contextlib
    import io

    from survey.cli import main

    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        try:
            status = main(["check", *args])
        except SystemExit as exc:
            status = exc.code
    return status, out.getvalue(), err.getvalue()


_label_text = st.text(st.characters(blacklist_categories=("Cs",)), max_size=40)


@settings(max_examples=60, deadline=None)
@given(label=_label_text)
def test_any_label_is_safe_in_the_table(label):
    """Random Unicode labels (control characters, markup brackets, escapes): no output line
    holds a control character other than newline and tab, and nothing raises."""
    status, out, err = _run(
        "--air-temp",
        "18",
        "--rh",
        "72",
        "--outdoor-temp",
        "3",
        "--outdoor-rh",
        "88",
        "--surface",
        f"external_wall:12:{label}",
    )
    assert status in (0, 2)
    assert _clean(out) and _clean(err)


@settings(max_examples=60, deadline=None)
@given(
    text=_label_text,
    option=st.sampled_from(
        [
            "--air-temp",
            "--rh",
            "--outdoor-temp",
            "--room-volume",
            "--occupants",
            "--target-rh",
            "--mould-area",
            "--altitude",
            "--pressure",
            "--rh-accuracy",
            "--showers-per-day",
            "--water-standing-hours",
            "--wet-area-pct",
            "--surface-temp",
            "--use",
        ]
    ),
)
def test_any_option_value_gives_a_clean_line(text, option):
    """Random text in any option: exit 0 or 2, and the error line shows no raw control
    character and stays short."""
    args = {"--air-temp": "18", "--rh": "72"}
    args[option] = text
    if option != "--outdoor-temp":
        args["--outdoor-temp"] = "3"
    args["--outdoor-rh"] = "88"
    status, out, err = _run(*(f"{k}={v}" for k, v in args.items()))
    assert status in (0, 2)
    assert _clean(out) and _clean(err)
    assert all(len(line) <= 700 for line in err.splitlines())


def test_json_keeps_the_label_exactly(check):
    """The JSON encoding keeps user text as it was (JSON escapes it)."""
    label = "NE corner [b] \x1b"
    status, out, _ = check(
        "--air-temp", "18", "--rh", "72", "--surface", f"external_wall:12:{label}", "--json"
    )
    assert status == 0
    assert json.loads(out)["surfaces"][0]["label"] == label
