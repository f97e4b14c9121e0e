"""The calc package build: project file, execution, conversion, pagination, manifest."""
