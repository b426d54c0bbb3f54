"""Fixtures for the model tests."""

from __future__ import annotations

import pytest

from workbench.model import document as document_module


@pytest.fixture
def derived(monkeypatch: pytest.MonkeyPatch) -> list[str]:
    """The names of the cases the document derives (on its own thread) from now on, in order."""
    names: list[str] = []
    real = document_module.evaluate_case
    monkeypatch.setattr(document_module, "evaluate_case",
                        lambda session, case, **kw: names.append(case.name) or real(
                            session, case, **kw))
    return names
