"""Sections: exact geometric properties of rolled and built-up shapes, and the rolled-section catalog.

See :mod:`calckit.sections.base` for the axis and modulus naming convention.
"""
from .base import Section, SectionProps
from .shapes import BuiltUp, Channel, Hollow, IShape, Plate, PlateGirder, SolidRect, Tee
from .catalog import catalog, families, names, section

__all__ = ["Section", "SectionProps", "IShape", "PlateGirder", "Channel", "Tee", "SolidRect", "Hollow",
           "Plate", "BuiltUp", "section", "catalog", "names", "families"]

