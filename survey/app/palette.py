"""Command palette entries in "area: action" form, for what makes sense on the screen shown."""

from __future__ import annotations

from functools import partial

from textual.command import DiscoveryHit, Hit, Provider


class SurveyCommands(Provider):
    def _commands(self):
        app = self.app
        found = [("help: keys", app.action_help), ("check: quick check", app.action_quick_check)]
        if app.editor is not None:
            found += [
                ("walk: site", partial(app.go, "site")),
                ("walk: visit", partial(app.go, "visit")),
                ("walk: rooms", partial(app.go, "rooms")),
                ("walk: site findings", partial(app.go, "findings")),
                ("report: preview and write", partial(app.go, "report")),
                ("file: save now", app.action_save),
            ]
        screen = self.screen
        for name, title in (
            ("next_room", "rooms: next room to read"),
            ("add_room", "rooms: add a room"),
            ("drying", "rooms: drying progress"),
            ("add_surface", "room: add a surface"),
            ("add_material", "room: add a material reading"),
            ("new_visit", "visit: start a new visit"),
        ):
            method = getattr(screen, f"action_{name}", None)
            if method is not None:
                found.append((title, method))
        write = getattr(screen, "action_write", None)
        if write is not None:
            found += [
                ("report: write the Markdown report", partial(write, "md")),
                ("report: write the HTML report", partial(write, "html")),
            ]
        return found

    async def discover(self):
        for title, callback in self._commands():
            yield DiscoveryHit(title, callback)

    async def search(self, query: str):
        matcher = self.matcher(query)
        for title, callback in self._commands():
            score = matcher.match(title)
            if score > 0:
                yield Hit(score, matcher.highlight(title), callback)
