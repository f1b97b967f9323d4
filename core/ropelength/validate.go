package ropelength

import (
	"fmt"
	"math"
	"strconv"

	"swaysheet/core/scenario"
)

type checker struct{ errs scenario.Errors }

func (c *checker) add(field, format string, args ...any) {
	c.errs = append(c.errs, scenario.FieldError{Field: field, Message: fmt.Sprintf(format, args...)})
}

// value checks v against its range; a nil v is reported when required.
func (c *checker) value(field string, v *float64, required bool) {
	r := Ranges[field]
	switch {
	case v == nil && required:
		c.add(field, "is required: %s", r.Text())
	case v == nil:
	case math.IsNaN(*v) || math.IsInf(*v, 0) || *v > r.Max || *v < r.Min || (r.OpenMin && *v == r.Min):
		c.add(field, "%s is out of range: %s", strconv.FormatFloat(*v, 'g', -1, 64), r.Text())
	}
}

// Validate checks the input and names every bad field with its accepted
// range.
func (in *Input) Validate() error {
	var c checker
	if in.Heights == nil && in.Timed == nil {
		c.add("heights", "give heights (sheave and hook heights), a timed swing (timed.swings and timed.time_s), or both")
	}
	if h := in.Heights; h != nil {
		c.value("heights.sheave_height_m", h.SheaveHeightM, true)
		c.value("heights.hook_height_m", h.HookHeightM, true)
		c.value("heights.sling_depth_m", &h.SlingDepthM, false)
		c.value("heights.centre_depth_m", &h.CentreDepthM, false)
		if len(c.errs) == 0 {
			rope := *h.SheaveHeightM - *h.HookHeightM
			l := rope + h.SlingDepthM + h.CentreDepthM
			lr := scenario.Ranges["load.rope_length_m"]
			switch {
			case rope <= 0:
				c.add("heights.hook_height_m", "the hook (%g m) must be below the sheave (%g m)", *h.HookHeightM, *h.SheaveHeightM)
			case in.Hook == nil && (l < lr.Min || l > lr.Max):
				c.add("heights.sheave_height_m", "the heights give a rope length of %.4g m, outside the model's range (%s)", l, lr.Text())
			case in.Hook != nil && (rope < lr.Min || rope > lr.Max):
				c.add("heights.sheave_height_m", "the heights give a rope to the hook of %.4g m, outside the model's range (%s)", rope, lr.Text())
			}
		}
	}
	if t := in.Timed; t != nil {
		c.value("timed.swings", t.Swings, true)
		c.value("timed.time_s", t.TimeS, true)
		c.value("timed.amplitude_deg", &t.AmplitudeDeg, false)
		c.value("timed.timing_error_s", &t.TimingErrorS, false)
	}
	if h := in.Hook; h != nil {
		c.value("hook.mass_kg", h.MassKg, true)
		c.value("hook.load_mass_kg", h.LoadMassKg, true)
		switch {
		case h.RiggingLengthM != 0:
			c.value("hook.rigging_length_m", &h.RiggingLengthM, true)
		case in.Heights == nil:
			c.add("hook.rigging_length_m", "is required: %s", Ranges["hook.rigging_length_m"].Text())
		case in.Heights.SlingDepthM+in.Heights.CentreDepthM == 0:
			c.add("hook.rigging_length_m", "is required (or heights.sling_depth_m and heights.centre_depth_m): %s", Ranges["hook.rigging_length_m"].Text())
		}
	}
	if in.Load != nil && len(c.errs) == 0 {
		in.validateLoad(&c)
	}
	if len(c.errs) > 0 {
		return c.errs
	}
	return nil
}
