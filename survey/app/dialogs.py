"""Small modal dialogs: a few lines of text to fill in, or a yes/no question."""

from __future__ import annotations

from collections.abc import Sequence

from rich.text import Text
from textual import on
from textual.binding import Binding
from textual.containers import Vertical
from textual.screen import ModalScreen
from textual.widgets import Input, Label, Static

from survey.app.fields import Choice, plain

#: A line of a :class:`PromptDialog`: its label and value, and for a choice from a list
#: its options as (words shown, value kept).
PromptField = tuple[str, str] | tuple[str, str, Sequence[tuple[str, str]]]


class PromptDialog(ModalScreen[list[str] | None]):
    """Fill in one or more lines; Enter on the last one answers, Escape cancels. A line
    given options is a drop-down (:class:`~survey.app.fields.Choice`: Enter opens it, a
    choice moves on); its answer is the chosen option's value.

    ``check(values) -> message`` may refuse the answer ('' accepts it)."""

    BINDINGS = [Binding("escape", "cancel", "Cancel", id="dialog_cancel")]

    def __init__(self, title: str, fields: list[PromptField], check=None, note: str = "") -> None:
        super().__init__()
        self.title_text = title
        self.fields = fields
        self.check = check
        self.note = note

    def compose(self):
        with Vertical(classes="dialog"):
            yield Static(Text(self.title_text, style="bold"))
            if self.note:
                yield Static(plain(self.note), classes="dialog-note")
            for index, (label, value, *options) in enumerate(self.fields):
                yield Label(label, markup=False)
                if options:
                    yield Choice(
                        [(Text(shown), kept) for shown, kept in options[0]],
                        value=value,
                        allow_blank=False,
                        compact=True,
                        id=f"prompt-{index}",
                    )
                else:
                    yield Input(value, id=f"prompt-{index}", compact=True)
            yield Static("", id="prompt-message", classes="field-message")
            yield Static(Text("Enter: next / done    Escape: cancel", style="dim"))

    def _lines(self) -> list[Input | Choice]:
        return [self.query_one(f"#prompt-{i}") for i in range(len(self.fields))]  # type: ignore[misc]

    @on(Input.Submitted)
    def _next(self, event: Input.Submitted) -> None:
        event.stop()
        lines = self._lines()
        index = lines.index(event.input)
        if index + 1 < len(lines):
            lines[index + 1].focus()
            return
        values = [str(line.value) for line in lines]
        problem = self.check(values) if self.check else ""
        if problem:
            message = self.query_one("#prompt-message", Static)
            message.update(plain(problem))
            message.add_class("-error")
            message.display = True
            return
        self.dismiss(values)

    def action_cancel(self) -> None:
        self.dismiss(None)


class ConfirmDialog(ModalScreen[bool]):
    """A question answered with y or n (Escape is no)."""

    BINDINGS = [
        Binding("y", "answer(True)", "Yes", id="dialog_yes"),
        Binding("n,escape", "answer(False)", "No", id="dialog_no"),
    ]

    def __init__(self, question: str) -> None:
        super().__init__()
        self.question = question

    def compose(self):
        with Vertical(classes="dialog"):
            yield Static(plain(self.question))
            yield Static(Text("y: yes    n or Escape: no", style="dim"))

    def action_answer(self, yes: bool) -> None:
        self.dismiss(yes)
