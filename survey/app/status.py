"""The status line: when the survey was last saved, or that saving failed."""

from __future__ import annotations

from textual.widgets import Static

from survey.app.fields import plain


class StatusBar(Static):
    DEFAULT_CLASSES = "status-bar"

    def on_mount(self) -> None:
        self.show(self.app.status_text, self.app.status_kind)

    def show(self, text: str, kind: str = "") -> None:
        self.update(plain(text))
        for name in ("error", "saved"):
            self.set_class(kind == name, f"-{name}")
