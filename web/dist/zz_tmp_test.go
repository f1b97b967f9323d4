package dist

import (
	"os"
	"testing"
)

func TestZZJumps(t *testing.T) {
	in, err := os.ReadFile(os.Getenv("ZZ_IN"))
	if err != nil {
		t.Skip()
	}
	out, st, err := Pack(in)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("%+v %d -> %d", st, len(in), len(out))
	os.WriteFile(os.Getenv("ZZ_OUT"), out, 0o644)
}
