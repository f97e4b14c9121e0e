"""The checker's review comments: a TOML file beside the notebooks, kept under version control.

Each comment names a sheet (the notebook path relative to the project directory) and optionally
a quantity, has a status that moves open -> answered -> closed (and may be reopened), and keeps
a history of who said what when. The checker's signature is refused while any comment is not
closed, unless an explicit override is given; every override is recorded in the file.

File layout (``review.toml``); ``by``, ``date`` and ``text`` are the opening entry, ``history``
lists what followed::

    [[comments]]
    id = "C1"
    sheet = "sheets/02-lintel.ipynb"
    quantity = "M_max"
    status = "answered"
    by = "T. Redfern"
    date = "2026-03-02T10:14:00+00:00"
    text = "Check the load width used for w."

    [[comments.history]]
    when = "2026-03-03T09:01:00+00:00"
    who = "I. Calloway"
    action = "answered"
    text = "Revised to 1.5 m."

    [[overrides]]                 # the checker signed over open comments
    when = "..."
    who = "..."
    reason = "..."
    comments = ["C1"]

    [[overrides]]                 # a key made for another role or person (sign --override-identity)
    when = "..."
    who = "..."
    reason = "..."
    kind = "identity"
    role = "checker"
    contradictions = ["the key ... was made for the role 'preparer', not 'checker'"]
"""

from __future__ import annotations

import datetime as dt
import os
import tomllib
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any

from calcpack.errors import InputError, SigningError
from calcpack.fileio import write_atomically

__all__ = [
    "REVIEW_FILE",
    "Comment",
    "Entry",
    "Override",
    "ReviewLog",
    "add_comment",
    "answer_comment",
    "close_comment",
    "load_review",
    "record_identity_override",
    "record_override",
    "reopen_comment",
    "review_path",
    "review_text",
]

#: Name of the review file in the project directory.
REVIEW_FILE = "review.toml"

STATUSES = ("open", "answered", "closed")


@dataclass(frozen=True)
class Entry:
    """One line of a comment's history: who did what when, and what they said."""

    when: str
    who: str
    action: str  # "opened" | "answered" | "closed" | "reopened"
    text: str


@dataclass(frozen=True)
class Comment:
    """A review comment on a sheet, optionally on one quantity of it."""

    id: str
    sheet: str
    quantity: str | None
    status: str
    history: tuple[Entry, ...]

    @property
    def text(self) -> str:
        """What the comment asked when it was opened."""
        return self.history[0].text if self.history else ""


OVERRIDE_KINDS = ("open-comments", "identity")


@dataclass(frozen=True)
class Override:
    """A signer's decision to sign against a rule, and why.

    Attributes:
        when, who, reason: when, by whom (the key's holder) and why.
        comments: ids of the review comments not closed (kind ``"open-comments"``).
        kind: ``"open-comments"`` (the checker signed over open comments) or ``"identity"``
            (a key made for another role or naming someone else than calcpack.toml).
        role: the role signed as.
        contradictions: what the key contradicted (kind ``"identity"``).
    """

    when: str
    who: str
    reason: str
    comments: tuple[str, ...] = ()
    kind: str = "open-comments"
    role: str = "checker"
    contradictions: tuple[str, ...] = ()

    def describe(self) -> str:
        """What was overridden and why, as a sentence (``"Signed as checker although ..."``)."""
        if self.kind == "identity":
            return f"Signed as {self.role} although {'; '.join(self.contradictions)}: {self.reason}"
        return f"Signed with {', '.join(self.comments)} not closed: {self.reason}"

    def text(self) -> str:
        """One line for the review log and verify."""
        what = self.describe()
        return f"OVERRIDE {self.when}  {self.who} {what[0].lower()}{what[1:]}"


@dataclass(frozen=True)
class ReviewLog:
    """All comments and overrides of a project."""

    comments: tuple[Comment, ...] = ()
    overrides: tuple[Override, ...] = ()

    def unresolved(self) -> tuple[Comment, ...]:
        """Comments not yet closed (open or answered): they block the checker's signature."""
        return tuple(c for c in self.comments if c.status != "closed")

    def get(self, comment_id: str) -> Comment:
        """The comment with this id; raises InputError naming the id if there is none."""
        for comment in self.comments:
            if comment.id == comment_id:
                return comment
        known = ", ".join(c.id for c in self.comments) or "none"
        raise InputError(
            f"No review comment with id {comment_id!r} (comments: {known})",
            name="id",
            value=comment_id,
            expected=f"one of: {known}",
        )

    def text(self, *, include_closed: bool = True) -> str:
        """The review log as plain text, one block per comment, overrides last."""
        lines: list[str] = []
        for c in self.comments:
            if c.status == "closed" and not include_closed:
                continue
            on = f"{c.sheet}" + (f", {c.quantity}" if c.quantity else "")
            lines.append(f"{c.id} [{c.status}] {on}")
            for e in c.history:
                lines.append(f"    {e.when}  {e.who} ({e.action}): {e.text}")
        lines += [o.text() for o in self.overrides]
        return "\n".join(lines) if lines else "No review comments."

    def to_data(self) -> dict[str, Any]:
        """The log as plain data (the TOML file's content; also for the package manifest)."""
        comments = []
        for c in self.comments:
            opening, later = (c.history[0], c.history[1:]) if c.history else (None, ())
            item: dict[str, Any] = {"id": c.id, "sheet": c.sheet}
            if c.quantity:
                item["quantity"] = c.quantity
            item["status"] = c.status
            if opening is not None:
                item.update(by=opening.who, date=opening.when, text=opening.text)
            if later:
                item["history"] = [
                    {"when": e.when, "who": e.who, "action": e.action, "text": e.text}
                    for e in later
                ]
            comments.append(item)
        data: dict[str, Any] = {"comments": comments}
        if self.overrides:
            data["overrides"] = [_override_data(o) for o in self.overrides]
        return data


def _override_data(o: Override) -> dict[str, Any]:
    item: dict[str, Any] = {"when": o.when, "who": o.who, "reason": o.reason}
    if o.kind == "identity":
        item.update(kind=o.kind, role=o.role, contradictions=list(o.contradictions))
    else:
        item["comments"] = list(o.comments)
    return item


def review_path(project: str | os.PathLike[str]) -> Path:
    """Path of the review file of a project directory."""
    return Path(project) / REVIEW_FILE


def _now() -> str:
    return dt.datetime.now(dt.UTC).replace(microsecond=0).isoformat()


def _str(item: dict[str, Any], key: str, where: str) -> str:
    value = item.get(key)
    if not isinstance(value, str):
        raise InputError(
            f"{where}: {key} must be a string (got {key} = {value!r})",
            name=key,
            value=value,
            expected="a string",
        )
    return value


def _parse(data: dict[str, Any], source: str) -> ReviewLog:
    comments: list[Comment] = []
    for i, item in enumerate(data.get("comments", [])):
        where = f"{source}, comment {i + 1}"
        status = _str(item, "status", where)
        if status not in STATUSES:
            raise InputError(
                f"{where}: status must be one of {', '.join(STATUSES)} (got status = {status!r})",
                name="status",
                value=status,
                expected=" | ".join(STATUSES),
            )
        opening = Entry(
            when=_str(item, "date", where),
            who=_str(item, "by", where),
            action="opened",
            text=_str(item, "text", where),
        )
        later = tuple(
            Entry(
                when=_str(h, "when", where),
                who=_str(h, "who", where),
                action=_str(h, "action", where),
                text=str(h.get("text", "")),
            )
            for h in item.get("history", [])
        )
        history = (opening, *later)
        quantity = item.get("quantity")
        comments.append(
            Comment(
                id=_str(item, "id", where),
                sheet=_str(item, "sheet", where),
                quantity=str(quantity) if quantity else None,
                status=status,
                history=history,
            )
        )
    overrides = tuple(
        Override(
            when=_str(o, "when", f"{source}, override"),
            who=_str(o, "who", f"{source}, override"),
            reason=_str(o, "reason", f"{source}, override"),
            comments=tuple(str(c) for c in o.get("comments", [])),
            kind=_kind(o, source),
            role=str(o.get("role", "checker")),
            contradictions=tuple(str(c) for c in o.get("contradictions", [])),
        )
        for o in data.get("overrides", [])
    )
    return ReviewLog(comments=tuple(comments), overrides=overrides)


def _kind(item: dict[str, Any], source: str) -> str:
    kind = str(item.get("kind", "open-comments"))
    if kind not in OVERRIDE_KINDS:
        raise InputError(
            f"{source}, override: kind must be one of {', '.join(OVERRIDE_KINDS)} "
            f"(got kind = {kind!r})",
            name="kind",
            value=kind,
            expected=" | ".join(OVERRIDE_KINDS),
        )
    return kind


def load_review(project: str | os.PathLike[str]) -> ReviewLog:
    """The review log of a project directory (empty when there is no review file yet).

    Raises:
        InputError: the project directory does not exist, or the file is malformed.
    """
    directory = Path(project)
    if not directory.is_dir():
        raise InputError(
            f"Project directory {str(directory)!r} does not exist",
            name="project",
            value=str(directory),
        )
    path = review_path(directory)
    if not path.is_file():
        return ReviewLog()
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
    except (tomllib.TOMLDecodeError, UnicodeDecodeError) as exc:
        raise InputError(
            f"Review file {str(path)!r} is not valid TOML ({exc})", name="review", value=str(path)
        ) from exc
    return _parse(data, repr(str(path)))


def review_text(log: ReviewLog) -> str:
    """The review file's text for ``log``, as calcpack writes it."""
    import tomli_w

    header = "# Review comments of this calc package (managed by `calcpack review`).\n\n"
    body: str = tomli_w.dumps(log.to_data(), multiline_strings=True)
    return header + body


def _save(project: str | os.PathLike[str], log: ReviewLog) -> None:
    write_atomically(review_path(project), review_text(log))


def _nonempty(value: str, name: str) -> str:
    if not value or not value.strip():
        raise InputError(f"{name} must not be empty (got {name} = {value!r})", name=name)
    return value.strip()


def recorded_quantities(project: Path, sheet: str) -> set[str] | None:
    """The names of the values ``sheet`` recorded in the newest package manifest that lists it
    (in ``PROJECT/build``, ``PROJECT/issued`` or beside the project folder); None if none does."""
    import json

    candidates = [
        *project.glob("build/*.manifest.json"),
        *project.glob("issued/*.manifest.json"),
        *project.parent.glob("*.manifest.json"),
    ]
    candidates.sort(key=lambda f: f.stat().st_mtime, reverse=True)
    for path in candidates:
        try:
            data = json.loads(path.read_text("utf-8"))
        except (OSError, ValueError):
            continue
        for entry in data.get("sheets", []) if isinstance(data, dict) else []:
            if isinstance(entry, dict) and entry.get("path") == sheet:
                names: set[str] = set()
                for v in entry.get("values", []):
                    names.update(str(v[k]) for k in ("name", "symbol") if v.get(k))
                return names
    return None


def _require_recorded(project: Path, sheet: str, quantity: str) -> None:
    from calcpack.validate import suggest

    names = recorded_quantities(project, sheet)
    if names is None:
        raise InputError(
            f"No built package records the quantities of sheet {sheet!r}, so --quantity "
            f"{quantity!r} cannot be checked; build the package first (calcpack build), or "
            "leave out --quantity",
            name="quantity",
            value=quantity,
            expected="a quantity recorded on the sheet",
        )
    if quantity not in names:
        close = suggest(quantity, sorted(names))
        hint = f"; did you mean {', '.join(repr(c) for c in close)}?" if close else ""
        raise InputError(
            f"Sheet {sheet!r} records no quantity {quantity!r} (got quantity = {quantity!r}; "
            f"it records {len(names)}){hint}",
            name="quantity",
            value=quantity,
            expected="a quantity recorded on the sheet",
        )


def add_comment(
    project: str | os.PathLike[str],
    *,
    sheet: str,
    text: str,
    who: str,
    quantity: str | None = None,
    recorded: bool = False,
) -> Comment:
    """Open a new comment on ``sheet`` (a notebook path relative to the project directory).

    ``recorded=True``: the caller has just read ``quantity`` from the sheet's records (the build
    opening a comment for a disagreement of the checker's independent check), so it is not
    looked up in the latest package.

    Raises:
        InputError: empty text or name, the sheet notebook does not exist in the project, or
            ``quantity`` is not a quantity the sheet recorded in the latest build.
    """
    text = _nonempty(text, "text")
    who = _nonempty(who, "who")
    sheet = _nonempty(sheet, "sheet")
    if not (Path(project) / sheet).is_file():
        raise InputError(
            f"Sheet {sheet!r} is not a file in project {str(project)!r}; name the notebook "
            "path relative to the project directory",
            name="sheet",
            value=sheet,
        )
    if quantity is not None and quantity.strip() and not recorded:
        _require_recorded(Path(project), sheet, quantity.strip())
    log = load_review(project)
    numbers = [int(c.id[1:]) for c in log.comments if c.id[1:].isdigit()]
    comment = Comment(
        id=f"C{max(numbers, default=0) + 1}",
        sheet=sheet,
        quantity=quantity.strip() if quantity and quantity.strip() else None,
        status="open",
        history=(Entry(when=_now(), who=who, action="opened", text=text),),
    )
    _save(project, replace(log, comments=(*log.comments, comment)))
    return comment


def _transition(
    project: str | os.PathLike[str],
    comment_id: str,
    *,
    who: str,
    text: str,
    action: str,
    allowed_from: tuple[str, ...],
    to: str,
) -> Comment:
    who = _nonempty(who, "who")
    log = load_review(project)
    comment = log.get(comment_id)
    if comment.status not in allowed_from:
        raise InputError(
            f"Comment {comment_id} is {comment.status}; it can be {action} only when "
            f"{' or '.join(allowed_from)}",
            name="id",
            value=comment_id,
        )
    updated = replace(
        comment,
        status=to,
        history=(*comment.history, Entry(when=_now(), who=who, action=action, text=text)),
    )
    comments = tuple(updated if c.id == comment_id else c for c in log.comments)
    _save(project, replace(log, comments=comments))
    return updated


def answer_comment(
    project: str | os.PathLike[str], comment_id: str, *, text: str, who: str
) -> Comment:
    """Record the preparer's answer; the comment becomes ``answered``."""
    return _transition(
        project,
        comment_id,
        who=who,
        text=_nonempty(text, "text"),
        action="answered",
        allowed_from=("open", "answered"),
        to="answered",
    )


def close_comment(
    project: str | os.PathLike[str], comment_id: str, *, who: str, text: str = ""
) -> Comment:
    """The checker accepts the answer (or withdraws the comment); the comment becomes closed."""
    return _transition(
        project,
        comment_id,
        who=who,
        text=text.strip() or "closed",
        action="closed",
        allowed_from=("open", "answered"),
        to="closed",
    )


def reopen_comment(
    project: str | os.PathLike[str], comment_id: str, *, text: str, who: str
) -> Comment:
    """The checker is not satisfied: the comment is open again."""
    return _transition(
        project,
        comment_id,
        who=who,
        text=_nonempty(text, "text"),
        action="reopened",
        allowed_from=("answered", "closed"),
        to="open",
    )


def record_override(
    project: str | os.PathLike[str], *, who: str, reason: str, comments: tuple[str, ...]
) -> Override:
    """Record that the checker signed with ``comments`` not closed, and why."""
    override = Override(
        when=_now(),
        who=_nonempty(who, "who"),
        reason=_nonempty(reason, "reason"),
        comments=comments,
    )
    log = load_review(project)
    _save(project, replace(log, overrides=(*log.overrides, override)))
    return override


def record_identity_override(
    project: str | os.PathLike[str],
    *,
    who: str,
    role: str,
    reason: str,
    contradictions: tuple[str, ...],
) -> Override:
    """Record that ``who`` signed as ``role`` with a key that contradicts it, and why."""
    override = Override(
        when=_now(),
        who=_nonempty(who, "who"),
        reason=_nonempty(reason, "reason"),
        kind="identity",
        role=role,
        contradictions=contradictions,
    )
    log = load_review(project)
    _save(project, replace(log, overrides=(*log.overrides, override)))
    return override


def require_closed(project: str | os.PathLike[str], override: str | None) -> tuple[str, ...]:
    """Check the review before the checker signs.

    Returns:
        The ids of unresolved comments the override covers (empty when all are closed).

    Raises:
        SigningError: comments are not closed and no override reason is given.
    """
    unresolved = load_review(project).unresolved()
    if not unresolved:
        return ()
    ids = tuple(c.id for c in unresolved)
    if override is None or not override.strip():
        listed = ", ".join(f"{c.id} ({c.status}, {c.sheet})" for c in unresolved)
        raise SigningError(
            f"The checker cannot sign while review comments are not closed: {listed}. "
            "Close them with `calcpack review close ID`, or sign with "
            "--override-open-comments REASON (the override is recorded in the review log)"
        )
    return ids
