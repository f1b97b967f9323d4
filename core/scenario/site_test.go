package scenario

import (
	"strings"
	"testing"
)

func TestSiteMessagesNameTheField(t *testing.T) {
	base := `{"format":"swaysheet-scenario","version":1,"name":"t","load":{"mass_kg":1000,"rope_length_m":8},"motions":[],"site":%s}`
	cases := map[string]string{
		`{"load_radius_m":1,"obstacles":[]}`: "site.suspension_height_m: is required",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[{"name":"a","corners":[{"x_m":0,"y_m":0}]}]}`:                                            "site.obstacles[0].top_m: is required",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[{"name":"a","top_m":3,"corners":[{"x_m":0,"y_m":0}]}]}`:                                  "site.obstacles[0].corners: has 1 corners",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[{"name":"a","top_m":3,"box":{"centre_x_m":0,"centre_y_m":0,"length_m":0,"width_m":1}}]}`: "site.obstacles[0].box.length_m: 0 is out of range",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[],"spread":{"runs":99999}}`:                                                              "site.spread.runs: 99999 is out of range",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[],"spread":{"emergency_stop":{}}}`:                                                       "site.spread.emergency_stop.reaction_s: is required",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[],"spread":{"emergency_stop":{"reaction_s":11}}}`:                                        "site.spread.emergency_stop.reaction_s: 11 is out of range",
		`{"suspension_height_m":12,"load_radius_m":1,"obstacles":[],"spread":{"emergency_stop":{"reaction_s":1,"decel_m_per_s2":0}}}`:                      "site.spread.emergency_stop.decel_m_per_s2: 0 is out of range",
		`{"suspension_height_m":0.1,"load_radius_m":1,"obstacles":[]}`:                                                                                     "site.suspension_height_m: 0.1 is out of range: accepted from 0.5 up to 300 m",
	}
	for site, want := range cases {
		_, err := Parse([]byte(strings.Replace(base, "%s", site, 1)))
		if err == nil || !strings.Contains(err.Error(), want) {
			t.Errorf("%s: got %v, want %q", site, err, want)
		}
	}
	ok := `{"suspension_height_m":12,"margin_m":0.5,"load_radius_m":1,"obstacles":[{"name":"column","top_m":9,"box":{"centre_x_m":10,"centre_y_m":3,"length_m":0.4,"width_m":0.4}},{"name":"stack","top_m":2.5,"corners":[{"x_m":0,"y_m":5},{"x_m":4,"y_m":5},{"x_m":4,"y_m":7}]}],"spread":{"runs":100,"seed":7,"rope_length_m":0.2}}`
	if _, err := Parse([]byte(strings.Replace(base, "%s", ok, 1))); err != nil {
		t.Errorf("a good site: %v", err)
	}
	// A recorded move has no braking rate of its own: the stop needs one.
	rec := `{"format":"swaysheet-scenario","version":1,"name":"t","load":{"mass_kg":1000,"rope_length_m":8},` +
		`"motions":[{"axis":"travel_x","profile":"series","csv":"time_s,travel_x_m_per_s\n0,0\n2,0.5\n4,0\n"}],` +
		`"site":{"suspension_height_m":12,"load_radius_m":1,"obstacles":[],"spread":{"emergency_stop":{"reaction_s":1}}}}`
	if _, err := Parse([]byte(rec)); err == nil || !strings.Contains(err.Error(), "site.spread.emergency_stop.decel_m_per_s2: is required: motion 1 is a record") {
		t.Errorf("a record without the stop's braking: %v", err)
	}
	if _, err := Parse([]byte(strings.Replace(rec, `"reaction_s":1}`, `"reaction_s":1,"decel_m_per_s2":0.5}`, 1))); err != nil {
		t.Errorf("a record with the stop's braking: %v", err)
	}
}
