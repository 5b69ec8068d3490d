"""The key footer: the keys of the focused widget and its screen, on one line.

One widget that draws one line, not a widget per key: Textual's own footer mounts and styles
a widget for every key each time the keys change (and once more after every screen is first
shown), which was the larger part of the app's start-up and of a screen change. This one
draws the same keys in the theme's footer colours, dims a key that is disabled, redraws only
when the keys on show change, and presses a key when it is clicked."""

from __future__ import annotations

from collections.abc import Hashable
from typing import NamedTuple

from textual import events
from textual.content import Content
from textual.screen import Screen
from textual.style import Style
from textual.widget import Widget


class ShownKey(NamedTuple):
    """One key on show: what is pressed, what the footer shows for it, and what it does."""

    key: str
    display: str
    description: str
    action: str
    enabled: bool


class KeysFooter(Widget):
    """The footer line of a screen."""

    DEFAULT_CSS = """
    KeysFooter {
        dock: bottom;
        height: 1;
        width: 1fr;
        color: $footer-foreground;
        background: $footer-background;
        text-wrap: nowrap;
        text-overflow: clip;
    }
    """

    _shown: Hashable = None
    _content: Content | None = None
    #: Where each key is drawn: first and past-last column, and the key.
    _spans: list[tuple[int, int, str]] = []

    def shown_keys(self) -> list[ShownKey]:
        """The keys on show now, in the order the footer shows them: each action once (its
        first key), the help key first and the command palette's last."""
        app = self.app
        bindings = self.screen.active_bindings

        def shown(binding, enabled: bool) -> ShownKey:
            return ShownKey(
                binding.key,
                app.get_key_display(binding),
                binding.description,
                binding.action,
                enabled,
            )

        keys: list[ShownKey] = []
        actions: set[str] = set()
        for _node, binding, enabled, _tooltip in bindings.values():
            if not binding.show or binding.action in actions:
                continue
            actions.add(binding.action)
            keys.append(shown(binding, enabled))
        # the key to every key first: at 80 columns not all of a screen's keys fit
        keys.sort(key=lambda k: k.action != "help")
        palette = bindings.get(app.COMMAND_PALETTE_BINDING) if app.ENABLE_COMMAND_PALETTE else None
        if palette is not None:
            _node, binding, enabled, _tooltip = palette
            keys = [k for k in keys if k.action != binding.action]
            keys.append(shown(binding, enabled))
        return keys

    def on_mount(self) -> None:
        self.screen.bindings_updated_signal.subscribe(self, self.bindings_changed)

    def on_unmount(self) -> None:
        self.screen.bindings_updated_signal.unsubscribe(self)

    def bindings_changed(self, screen: Screen) -> None:
        if self.is_attached and screen is self.screen and self._keys() != self._shown:
            self.refresh()

    def _keys(self) -> tuple[str, int, tuple[ShownKey, ...]]:
        """The keys on show, with the theme and width they were drawn for."""
        return self.app.theme, self.size.width, tuple(self.shown_keys())

    def render(self) -> Content:
        keys = self._keys()
        if self._content is None or keys != self._shown:
            self._shown, self._content = keys, self._draw(keys[2], keys[1])
        return self._content

    def _draw(self, keys: tuple[ShownKey, ...], width: int) -> Content:
        """The line: the keys from the left in their order, each whole (one too long for the
        room left is passed over for the shorter ones after it), and the command palette's
        at the right end."""
        palette = self.app.COMMAND_PALETTE_BINDING
        right = [(k, self._piece(k)) for k in keys if k.key == palette]
        room = width - sum(piece.cell_length for _, piece in right)
        left: list[tuple[ShownKey, Content]] = []
        used = 0
        for key in keys:
            if key.key == palette:
                continue
            piece = self._piece(key)
            if used + piece.cell_length > room:
                continue  # too long for what is left: a shorter one after it may fit
            left.append((key, piece))
            used += piece.cell_length
        gap = max(0, room - used)
        self._spans = []
        x = 0
        for n, (key, piece) in enumerate(left + right):
            if n == len(left):
                x += gap
            self._spans.append((x, x + piece.cell_length, key.key))
            x += piece.cell_length
        return Content.assemble(*(p for _, p in left), " " * gap, *(p for _, p in right))

    def on_click(self, event: events.Click) -> None:
        """A click on a key presses it."""
        for start, end, key in self._spans:
            if start <= event.x < end:
                event.stop()
                self.app.simulate_key(key)
                return

    @staticmethod
    def _piece(shown: ShownKey) -> Content:
        dim = "" if shown.enabled else " dim"
        key_style = Style.parse(f"bold $footer-key-foreground on $footer-key-background{dim}")
        text_style = Style.parse(
            f"$footer-description-foreground on $footer-description-background{dim}"
        )
        # " key description " with one space more before the next key: two columns a key
        # fewer than a padded key cell, so at 80 columns the app's own keys fit too
        parts: list[str | tuple[str, str | Style]] = [(f" {shown.display} ", key_style)]
        if shown.description:
            parts.append((f"{shown.description} ", text_style))
        return Content.assemble(*parts)
