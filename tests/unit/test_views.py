"""The renderer registry: results ask it for their pictures; an unregistered view is refused
with a message naming the class, the view and what is registered."""

from __future__ import annotations

import pickle

import pytest

from calcpack import views
from calcpack.errors import NoViewError
from calcpack.sections import Rectangle
from calcpack.units import ureg


class _Thing:
    pass


class _SubThing(_Thing):
    pass


def test_a_registered_renderer_serves_subclasses_and_is_imported_by_name() -> None:
    name = f"{_Thing.__module__}.{_Thing.__qualname__}"
    views.register(name, "caption", lambda obj, *, words="": f"{type(obj).__name__} {words}")
    views.register(name, "plain", "builtins:repr")
    thing = _SubThing()
    assert views.render("caption", thing, words="drawn") == "_SubThing drawn"
    assert views.render("plain", thing) == repr(thing)
    assert views.registered(thing) == ("caption", "plain")


def test_an_unregistered_view_is_refused_naming_what_is_known() -> None:
    with pytest.raises(NoViewError) as info:
        views.render("hologram", Rectangle(b=10 * ureg.mm, d=20 * ureg.mm))
    text = str(info.value)
    assert "'hologram'" in text
    assert "calcpack.sections" in text
    assert "figure, svg" in text
    again = pickle.loads(pickle.dumps(info.value))
    assert str(again) == text


def test_computation_results_draw_through_the_registry() -> None:
    svg = Rectangle(b=10 * ureg.mm, d=20 * ureg.mm).svg()
    assert svg.lstrip().startswith("<")
