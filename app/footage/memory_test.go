package footage

import (
	"bufio"
	"bytes"
	"fmt"
	"image"
	"image/color"
	"image/gif"
	"image/png"
	"os"
	"os/exec"
	"path/filepath"
	"runtime/metrics"
	"strconv"
	"strings"
	"sync"
	"sync/atomic"
	"testing"
	"time"
)

// The memory cap is checked by measuring the process, not by the cache's
// own accounting: each case runs in a child process (this test binary,
// selected by an environment variable), which opens hostile footage made
// by the parent, shows its frames, and reports the peak resident set size
// (VmHWM in /proc/self/status, Linux proc(5)) and the resident size before
// it opened anything; under the race detector, whose shadow memory is not
// the program's, the peak of the Go runtime's total mapped memory
// (runtime/metrics, sampled every 200 us) instead. The growth must stay within the cap, the headroom
// of the soft memory limit and a fixed allowance for the test binary's own
// work (slackBytes).

const (
	memCaseEnv = "PROPFLIGHT_FOOTAGE_MEMCASE"
	slackBytes = 16 << 20
)

// procStatus returns a "VmXXX:" value of /proc/self/status in bytes.
func procStatus(key string) (int64, bool) {
	f, err := os.Open("/proc/self/status")
	if err != nil {
		return 0, false
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		if rest, ok := strings.CutPrefix(sc.Text(), key+":"); ok {
			fields := strings.Fields(rest)
			if len(fields) == 2 && fields[1] == "kB" {
				n, err := strconv.ParseInt(fields[0], 10, 64)
				return n << 10, err == nil
			}
		}
	}
	return 0, false
}

// gifRepeat returns a GIF of the logical screen of frame, holding n copies
// of frame, each shown for 4/100 s; it encodes frame once and repeats its
// blocks, so a huge or long GIF is made in no time and is small on disk
// when frame compresses well.
func gifRepeat(t testing.TB, frame *image.Paletted, n int) []byte {
	t.Helper()
	var one bytes.Buffer
	b := frame.Bounds()
	if err := gif.EncodeAll(&one, &gif.GIF{Image: []*image.Paletted{frame}, Delay: []int{4},
		Config: image.Config{ColorModel: frame.Palette, Width: b.Max.X, Height: b.Max.Y}}); err != nil {
		t.Fatal(err)
	}
	// A one-frame GIF from image/gif: header and screen (13 bytes), the
	// global colour table, the frame's blocks, the trailer (GIF89a §17-27).
	data := one.Bytes()
	head := 13 + 3<<((data[10]&7)+1)
	block := data[head : len(data)-1]
	out := bytes.NewBuffer(make([]byte, 0, head+n*len(block)+1))
	out.Write(data[:head])
	for range n {
		out.Write(block)
	}
	out.WriteByte(0x3B)
	return out.Bytes()
}

// memCase is one hostile footage and how the child shows it.
type memCase struct {
	name     string
	capBytes int64
	make     func(t *testing.T, dir string) string // writes the footage, returns its path
	show     func(s *Sequence) error
}

var memPalette = color.Palette{color.RGBA{}, color.RGBA{200, 30, 30, 255}, color.RGBA{30, 200, 30, 255}}

// memCases returns the footage sources the memory tests open. Long: a
// table, one entry a source.
func memCases() []memCase {
	frames := func(order ...int) func(s *Sequence) error {
		return func(s *Sequence) error {
			for _, i := range order {
				if _, err := s.Frame(i); err != nil {
					return err
				}
			}
			return nil
		}
	}
	var sweep []int
	for i := range 6 {
		sweep = append(sweep, i)
	}
	for i := 5; i >= 0; i-- {
		sweep = append(sweep, i)
	}
	var long []int
	for i := range 3000 {
		long = append(long, i)
	}
	long = append(long, 1500, 2999, 7, 2000, 10, 2500)
	return []memCase{
		{
			// 6 frames of 2000 x 2000 in a file of about 25 KB: 24 MB as
			// palette images, 16 MB a composite.
			name: "huge GIF frames", capBytes: 48 << 20,
			make: func(t *testing.T, dir string) string {
				m := image.NewPaletted(image.Rect(0, 0, 2000, 2000), memPalette)
				for i := range m.Pix {
					m.Pix[i] = 1
				}
				p := filepath.Join(dir, "huge.gif")
				os.WriteFile(p, gifRepeat(t, m, 6), 0o644)
				return p
			},
			show: frames(append(sweep, 3)...),
		},
		{
			// A million 1 x 1 frames, about 20 MB on disk.
			name: "a million tiny GIF frames", capBytes: 128 << 20,
			make: func(t *testing.T, dir string) string {
				m := image.NewPaletted(image.Rect(0, 0, 1, 1), memPalette)
				m.Pix[0] = 2
				p := filepath.Join(dir, "tiny.gif")
				os.WriteFile(p, gifRepeat(t, m, 1_000_000), 0o644)
				return p
			},
			show: frames(long...),
		},
		{
			// 16 PNG frames of 1500 x 1500 (9 MB each decoded), shown by
			// two goroutines at once, as the window and its prefetch do.
			name: "large PNG frames", capBytes: 40 << 20,
			make: func(t *testing.T, dir string) string {
				var buf bytes.Buffer
				png.Encode(&buf, indexFrame(1500, 1500, 1))
				for i := range 16 {
					os.WriteFile(filepath.Join(dir, fmt.Sprintf("f%02d.png", i)), buf.Bytes(), 0o644)
				}
				return dir
			},
			show: func(s *Sequence) error {
				var wg sync.WaitGroup
				errs := make([]error, 2)
				for g := range 2 {
					wg.Add(1)
					go func() {
						defer wg.Done()
						for i := g; i < s.Len(); i += 2 {
							if _, err := s.Frame(i); err != nil {
								errs[g] = err
								return
							}
						}
					}()
				}
				wg.Wait()
				return errorsJoin(errs)
			},
		},
	}
}

// goMemory returns the memory the Go runtime holds from the operating
// system, bytes: runtime/metrics "/memory/classes/total:bytes" less
// "/memory/classes/heap/released:bytes" (mapped but given back).
func goMemory() int64 {
	m := []metrics.Sample{{Name: "/memory/classes/total:bytes"}, {Name: "/memory/classes/heap/released:bytes"}}
	metrics.Read(m)
	return int64(m[0].Value.Uint64()) - int64(m[1].Value.Uint64())
}

func errorsJoin(errs []error) error {
	for _, e := range errs {
		if e != nil {
			return e
		}
	}
	return nil
}

// TestFootageMemory_ProcessPeak runs every memCase in a child process and
// checks its measured peak.
func TestFootageMemory_ProcessPeak(t *testing.T) {
	if name := os.Getenv(memCaseEnv); name != "" {
		memChild(t, name)
		return
	}
	if _, ok := procStatus("VmHWM"); !ok {
		t.Skip("no /proc/self/status VmHWM to measure the process with")
	}
	for _, c := range memCases() {
		t.Run(c.name, func(t *testing.T) {
			dir := t.TempDir()
			path := c.make(t, dir)
			cmd := exec.Command(os.Args[0], "-test.run=^TestFootageMemory_ProcessPeak$", "-test.v")
			cmd.Env = append(os.Environ(), memCaseEnv+"="+c.name, "PROPFLIGHT_FOOTAGE_MEMPATH="+path, "GOMEMLIMIT=", "GOGC=")
			out, err := cmd.CombinedOutput()
			if err != nil {
				t.Fatalf("child: %v\n%s", err, out)
			}
			var base, peak int64
			for _, l := range strings.Split(string(out), "\n") {
				if rest, ok := strings.CutPrefix(strings.TrimSpace(l), "memcase: "); ok {
					fmt.Sscanf(rest, "base %d peak %d", &base, &peak)
				}
			}
			if peak == 0 {
				t.Fatalf("child reported nothing:\n%s", out)
			}
			allowed := c.capBytes + memoryHeadroom(c.capBytes) + slackBytes
			t.Logf("peak RSS %.1f MiB, %.1f MiB over the %.1f MiB before opening; allowed %.1f MiB over (cap %.0f MiB)",
				float64(peak)/(1<<20), float64(peak-base)/(1<<20), float64(base)/(1<<20), float64(allowed)/(1<<20), float64(c.capBytes)/(1<<20))
			if peak-base > allowed {
				t.Errorf("the process grew %.1f MiB showing the footage; the cap %.0f MiB allows %.1f MiB", float64(peak-base)/(1<<20), float64(c.capBytes)/(1<<20), float64(allowed)/(1<<20))
			}
		})
	}
}

// memChild is the child's side: open, show, report.
func memChild(t *testing.T, name string) {
	for _, c := range memCases() {
		if c.name != name {
			continue
		}
		base, _ := procStatus("VmRSS")
		goBase := goMemory()
		// The Go runtime's own total, sampled: what counts under the race
		// detector, whose shadow memory inflates the resident size.
		var goPeak atomic.Int64
		stop := make(chan struct{})
		done := make(chan struct{})
		go func() {
			defer close(done)
			tick := time.NewTicker(200 * time.Microsecond)
			defer tick.Stop()
			for {
				goPeak.Store(max(goPeak.Load(), goMemory()))
				select {
				case <-stop:
					return
				case <-tick.C:
				}
			}
		}()
		s, err := Open(os.Getenv("PROPFLIGHT_FOOTAGE_MEMPATH"), Options{CacheBytes: c.capBytes})
		if err != nil {
			t.Fatal(err)
		}
		if err := c.show(s); err != nil {
			t.Fatal(err)
		}
		close(stop)
		<-done
		peak, _ := procStatus("VmHWM")
		if raceDetector {
			base, peak = goBase, goPeak.Load()
		}
		fmt.Printf("memcase: base %d peak %d\n", base, peak)
		return
	}
	t.Fatalf("no case %q", name)
}
