package main

import (
	"fmt"
	"io"
	"os"
	"strings"
	"time"
)

// progressBar draws the progress of a long exact or Monte Carlo computation
// on standard error, when that is a terminal, at most ten times a second.
type progressBar struct {
	w     io.Writer
	on    bool
	drawn bool
	last  time.Time
}

func newProgressBar(w io.Writer) *progressBar {
	f, ok := w.(*os.File)
	on := false
	if ok {
		if info, err := f.Stat(); err == nil && info.Mode()&os.ModeCharDevice != 0 {
			on = true
		}
	}
	return &progressBar{w: w, on: on}
}

// show is a core.Progress.
func (b *progressBar) show(stage string, done, total int) {
	if !b.on || total <= 0 || (time.Since(b.last) < 100*time.Millisecond && done < total) {
		return
	}
	b.last = time.Now()
	const width = 30
	filled := width * done / total
	fmt.Fprintf(b.w, "\r%-12s [%s%s] %3d%%", stage, strings.Repeat("#", filled), strings.Repeat(" ", width-filled), 100*done/total)
	b.drawn = true
}

// clear removes the bar once the computation is over.
func (b *progressBar) clear() {
	if b.drawn {
		fmt.Fprintf(b.w, "\r%s\r", strings.Repeat(" ", 50))
	}
}
