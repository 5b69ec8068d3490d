"""A labelled input that parses what is typed through the core's parsers and commits it.

Enter commits and moves on; leaving the field commits too. A value that does not parse, or
that the record refuses, shows a message under the field (the field, what was typed, what is
allowed) and nothing is saved: the survey keeps its last good value.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

from rich.text import Text
from textual import events, on
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.message import Message
from textual.widgets import Checkbox, Input, Label, Select, Static
from textual.widgets._select import SelectOverlay

from survey.errors import InputError
from survey.safe_text import visible

#: ``parse(text) -> value`` raises InputError; ``commit(value) -> warning`` raises
#: InputError when the record refuses the value, returns a warning or "".
Parse = Callable[[str], Any]
Commit = Callable[[Any], str]


def plain(text: object, style: str = "") -> Text:
    """User or file text as Text: never markup, control characters visible."""
    return Text(visible("" if text is None else text), style=style)


class FieldInput(Input):
    """A field's input: text pasted with line breaks is refused with a message, not cut to
    its first line (a value pasted with the next one under it must not lose the second)."""

    def on_mount(self) -> None:
        self.cursor_position = 0  # a field not being typed in shows the start of its text

    def on_blur(self) -> None:
        self.cursor_position = 0

    def _on_paste(self, event: events.Paste) -> None:
        text = event.text
        if text and len(text.splitlines()) > 1:
            event.prevent_default()  # Input's own handler would keep the first line
            event.stop()
            field = self.parent.parent if self.parent is not None else None
            if isinstance(field, Field):
                lines = len(text.splitlines())
                field.show_message(
                    f"Not pasted: the text has {lines} lines; paste one value at a time"
                )
            return


class Field(Vertical):
    """``label [input] previous`` on one line, a message line under it when needed."""

    DEFAULT_CLASSES = "field"

    class Committed(Message):
        def __init__(self, field: Field, value: Any) -> None:
            super().__init__()
            self.field = field
            self.value = value

        @property
        def control(self) -> Field:
            return self.field

    class Preview(Message):
        """The text being typed parsed (``value`` None when it does not parse yet)."""

        def __init__(self, field: Field, value: Any) -> None:
            super().__init__()
            self.field = field
            self.value = value

        @property
        def control(self) -> Field:
            return self.field

    def __init__(
        self,
        label: str,
        text: str,
        parse: Parse,
        commit: Commit,
        *,
        id: str,
        previous: str = "",
        placeholder: str = "",
        live: bool = False,
        disabled: bool = False,
        on_enter=None,
    ) -> None:
        super().__init__(id=id)
        self.on_enter = on_enter
        self.label = label
        self.text = text
        self.parse = parse
        self.commit = commit
        self.previous = previous
        self.placeholder = placeholder
        self.live = live
        self.read_only = disabled
        self.committed_text = text
        self.warning = ""  #: the warning the last value was taken with ("" for none)

    def compose(self):
        with Horizontal(classes="field-row"):
            yield Label(self.label, classes="field-label", markup=False)
            yield FieldInput(
                self.text,
                placeholder=self.placeholder,
                compact=True,
                id=f"{self.id}-input",
                disabled=self.read_only,
            )
            if self.previous:
                yield Static(plain(self.previous), classes="field-previous")
        yield Static("", classes="field-message")

    @property
    def input(self) -> Input:
        return self.query_one(Input)

    def show_message(self, text: str, kind: str = "error") -> None:
        message = self.query_one(".field-message", Static)
        message.update(plain(text))
        message.set_class(kind == "error" and bool(text), "-error")
        message.set_class(kind == "warning" and bool(text), "-warning")
        message.display = bool(text)

    def set_text(self, text: str) -> None:
        """Show a stored value (after it changed elsewhere) without committing it."""
        self.committed_text = text
        self.input.value = text
        self.show_message("")

    def try_commit(self, force: bool = False) -> bool:
        """Parse and commit the text typed; True when it was taken (or unchanged)."""
        text = self.input.value
        if not force and text == self.committed_text and not self.has_class("-invalid"):
            return True
        try:
            value = self.parse(text)
            warning = self.commit(value)
        except InputError as exc:
            self.add_class("-invalid")
            kept = (
                f"The last good value, {self.committed_text.strip()}, is kept."
                if self.committed_text.strip()
                else "Nothing is saved here yet."
            )
            self.show_message(f"Not saved — {exc}. {kept}")
            return False
        self.remove_class("-invalid")
        self.committed_text = text
        self.warning = warning or ""
        self.show_message(self.warning, "warning")
        self.post_message(self.Committed(self, value))
        return True

    @on(Input.Submitted)
    def _submitted(self, event: Input.Submitted) -> None:
        event.stop()
        if self.try_commit():
            if self.on_enter is not None:
                self.on_enter()
            else:
                self.screen.focus_next()

    @on(Input.Blurred)
    def _blurred(self, event: Input.Blurred) -> None:
        if self.is_attached and not self.read_only:
            self.try_commit()

    @on(Input.Changed)
    def _changed(self, event: Input.Changed) -> None:
        event.stop()
        if not self.live:
            return
        try:
            value = self.parse(event.value)
        except InputError:
            value = None
        self.post_message(self.Preview(self, value))


class Choice(Select):
    """A drop-down list in a form. Enter (or Space, or an arrow) opens it; a choice made in
    it, by Enter or a click, moves on to the next field, as Enter does from a text field, so
    the list is not opened again by the next Enter; Escape closes it and stays. (The list's
    message is the pinned Textual release's own; a test holds it.)"""

    @on(SelectOverlay.UpdateSelection)
    def _chosen(self, event: SelectOverlay.UpdateSelection) -> None:
        # Select's own handler takes the value and focuses the select; move on after it.
        self.call_after_refresh(self.screen.focus_next)


class Tick(Checkbox):
    """A check box whose state is a symbol (✓ or blank), not a colour alone. Space ticks it;
    Enter moves on, as it does from every field (so a walk by Enter ticks nothing)."""

    BINDINGS = [
        Binding("space", "toggle_button", "Tick", id="tick_toggle", show=False),
        Binding("enter", "app.focus_next", "Next", id="tick_next", show=False),
    ]

    @property
    def _button(self):
        self.BUTTON_INNER = "✓" if self.value else " "
        return super()._button
